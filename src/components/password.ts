/** Shortest password the API accepts (its rule; checked here to answer before sending). */
export const MIN_PASSWORD = 10;
