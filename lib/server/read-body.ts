import "server-only";
import { AppError } from "./errors";

/**
 * Reads a request body of at most `maxBytes`, without ever holding more: a Content-Length above the cap
 * is refused before reading, and a streamed body is cancelled as soon as it passes the cap.
 * @param maxBytes - largest body accepted, bytes
 * @returns the body's bytes (empty when there is none)
 * @throws AppError("payload_too_large") past the cap
 */
export async function readBodyCapped(request: Request, maxBytes: number): Promise<Uint8Array<ArrayBuffer>> {
  const tooLarge = () => new AppError("payload_too_large", `The request body is larger than ${Math.round(maxBytes / 1024)} KiB.`);
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge();
  if (!request.body) return new Uint8Array(0);
  const chunks: Uint8Array[] = [];
  let received = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  const body = new Uint8Array(received);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}
