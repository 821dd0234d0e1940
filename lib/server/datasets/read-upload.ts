import "server-only";
import { AppError } from "@/lib/server/errors";
import { readBodyCapped } from "@/lib/server/read-body";

/** Room for the mapping JSON and the multipart framing on top of the file-size limit, bytes. */
const MULTIPART_OVERHEAD_BYTES = 256 * 1024;

/** The two parts of an upload, still untrusted. */
export type UploadParts = { file: File; mappingText: string } | { tooLarge: true };

/**
 * Reads a multipart upload, streaming the body and stopping once it exceeds the file limit plus the
 * overhead, so an oversized request never fills the server's memory. Within the limit the parts are taken
 * apart by the runtime's own multipart reader.
 * @param request - the POST request (multipart/form-data with `file` and `mapping`)
 * @param maxFileBytes - the dataset file-size limit, bytes
 */
export async function readUploadParts(request: Request, maxFileBytes: number): Promise<UploadParts> {
  const contentType = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\s*;/i.test(contentType))
    throw new AppError("bad_request", "Send the upload as multipart/form-data with the parts file and mapping.");
  if (!request.body) throw new AppError("bad_request", "The upload is empty; send the parts file and mapping.");

  let body: Uint8Array<ArrayBuffer>;
  try {
    body = await readBodyCapped(request, maxFileBytes + MULTIPART_OVERHEAD_BYTES);
  } catch (error) {
    if (error instanceof AppError && error.code === "payload_too_large") return { tooLarge: true };
    throw error;
  }

  let form: FormData;
  try {
    form = await new Response(body, { headers: { "content-type": contentType } }).formData();
  } catch (cause) {
    throw new AppError("bad_request", "The multipart body could not be read.", { cause });
  }
  const file = form.get("file");
  const mappingText = form.get("mapping");
  if (!(file instanceof File)) throw new AppError("bad_request", "The upload has no file part named “file”.");
  if (typeof mappingText !== "string") throw new AppError("bad_request", "The upload has no text part named “mapping”.");
  return { file, mappingText };
}
