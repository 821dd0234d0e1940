/**
 * PNG helpers for figure downloads: the pixel size from the header and a pHYs chunk so that word
 * processors and LaTeX place a 300 dpi image at its intended physical size. Layout from the PNG
 * specification (W3C, Portable Network Graphics, 3rd ed., §5 and §11.3.5.3): 8-byte signature, then chunks
 * of length (4 bytes, big-endian), type (4), data, CRC-32 over type and data; IHDR first, width at bytes
 * 16–19 and height at 20–23 of the file.
 */

const SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];
const INCH_IN_M = 0.0254;

let crcTable: Uint32Array | null = null;

/** CRC-32 as the PNG specification defines it (polynomial 0xEDB88320, reflected; its Annex D). */
export function crc32(bytes: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let crc = 0xffffffff;
  for (const byte of bytes) crc = crcTable[(crc ^ byte) & 0xff] ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

function checkSignature(png: Uint8Array): void {
  if (png.length < 33 || SIGNATURE.some((b, i) => png[i] !== b)) throw new RangeError("not a PNG file");
}

/** Width and height in pixels, read from the IHDR chunk. */
export function pngPixelSize(png: Uint8Array): { width: number; height: number } {
  checkSignature(png);
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  return { width: view.getUint32(16), height: view.getUint32(20) };
}

/**
 * The same PNG with a pHYs chunk (pixels per metre, unit "metre") right after IHDR, replacing none: the
 * canvas encoder writes no pHYs.
 * @param png - a PNG file without a pHYs chunk
 * @param dpi - resolution, dots per inch
 */
export function withPhysicalResolution(png: Uint8Array, dpi: number): Uint8Array {
  checkSignature(png);
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  const ihdrEnd = 8 + 12 + view.getUint32(8);
  const chunk = new Uint8Array(21);
  const chunkView = new DataView(chunk.buffer);
  const perMetre = Math.round(dpi / INCH_IN_M);
  chunkView.setUint32(0, 9);
  chunk.set([0x70, 0x48, 0x59, 0x73], 4); // "pHYs"
  chunkView.setUint32(8, perMetre);
  chunkView.setUint32(12, perMetre);
  chunk[16] = 1; // unit: metre
  chunkView.setUint32(17, crc32(chunk.subarray(4, 17)));
  const result = new Uint8Array(png.length + chunk.length);
  result.set(png.subarray(0, ihdrEnd), 0);
  result.set(chunk, ihdrEnd);
  result.set(png.subarray(ihdrEnd), ihdrEnd + chunk.length);
  return result;
}
