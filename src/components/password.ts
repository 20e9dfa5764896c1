/** Shortest password the API accepts (its rule; checked here to answer before sending). */
export const MIN_PASSWORD = 10;
/** Longest password the API accepts, in UTF-8 bytes (bcrypt reads no further, so longer ones are refused). */
export const MAX_PASSWORD_BYTES = 72;

/** What is wrong with `password` under the API's sign-up rule, in plain words, or null when it is acceptable. */
export function passwordProblem(password: string): string | null {
  if (password.length < MIN_PASSWORD) return `Use at least ${MIN_PASSWORD} characters.`;
  if (new TextEncoder().encode(password).length > MAX_PASSWORD_BYTES) return `Use at most ${MAX_PASSWORD_BYTES} bytes (about ${MAX_PASSWORD_BYTES} plain letters).`;
  return null;
}
