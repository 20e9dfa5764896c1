/**
 * Small image files for upload tests, built from the published formats:
 * PNG per the PNG specification (W3C, 3rd ed.): signature, IHDR, IDAT
 * (zlib), IEND, each chunk with a CRC-32; JPEG starts with SOI FF D8 and an
 * APP0 "JFIF" segment (ITU-T T.81 / JFIF 1.02); WebP is a RIFF container
 * with form type "WEBP" and a "VP8L" chunk (RFC 9649). GIF89a for a type we
 * refuse (GIF89a specification).
 */
import { crc32, deflateSync } from 'node:zlib';

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([len, body, crc]);
}

/** A valid 1x1 RGB PNG, optionally padded with a private ancillary chunk to `padTo` bytes. */
export function pngBytes(padTo = 0): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(1, 0);
  ihdr.writeUInt32BE(1, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour
  const raw = Buffer.from([0, 0x2a, 0x7f, 0xb0]); // filter byte + one pixel
  const parts = [Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw))];
  const base = Buffer.concat([...parts, chunk('IEND', Buffer.alloc(0))]).length;
  if (padTo > base + 12) parts.push(chunk('loOp', Buffer.alloc(padTo - base - 12)));
  return Buffer.concat([...parts, chunk('IEND', Buffer.alloc(0))]);
}

/** The start of a JFIF JPEG (enough for content sniffing). */
export function jpegBytes(): Buffer {
  return Buffer.concat([
    Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]),
    Buffer.from('JFIF\0', 'ascii'),
    Buffer.from([0x01, 0x02, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00, 0xff, 0xd9]),
  ]);
}

/** A lossless WebP container with a 1x1 VP8L bitstream header. */
export function webpBytes(): Buffer {
  const vp8l = Buffer.from([0x2f, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00]);
  const chunkHeader = Buffer.concat([Buffer.from('VP8L', 'ascii'), Buffer.from([vp8l.length, 0, 0, 0])]);
  const payload = Buffer.concat([Buffer.from('WEBP', 'ascii'), chunkHeader, vp8l, Buffer.alloc(vp8l.length % 2)]);
  const size = Buffer.alloc(4);
  size.writeUInt32LE(payload.length);
  return Buffer.concat([Buffer.from('RIFF', 'ascii'), size, payload]);
}

/** A GIF89a header (a real image type we do not accept). */
export function gifBytes(): Buffer {
  return Buffer.concat([Buffer.from('GIF89a', 'ascii'), Buffer.from([1, 0, 1, 0, 0, 0, 0, 0x3b])]);
}
