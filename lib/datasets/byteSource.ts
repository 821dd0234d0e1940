/**
 * The bytes of an uploaded file: a Web ReadableStream (fetch, Request.body, File.stream()), any async
 * iterable of chunks (a Node Readable), or the whole file when it is already in memory (tests, previews).
 */
export type ByteSource = ReadableStream<Uint8Array> | AsyncIterable<Uint8Array | string> | Uint8Array | string;

const encoder = new TextEncoder();

/** Largest chunk handed on, bytes: the parser splits and converts one chunk's rows at a time. */
const MAX_CHUNK_BYTES = 64 * 1024;

function* pieces(bytes: Uint8Array): Generator<Uint8Array> {
  if (bytes.byteLength <= MAX_CHUNK_BYTES) yield bytes;
  else for (let i = 0; i < bytes.byteLength; i += MAX_CHUNK_BYTES) yield bytes.subarray(i, i + MAX_CHUNK_BYTES);
}

/**
 * Yields the chunks of any {@link ByteSource} as bytes, in order, without collecting them; chunks larger
 * than 64 KiB (a whole file in memory) are handed on in 64 KiB views.
 */
export async function* byteChunks(source: ByteSource): AsyncGenerator<Uint8Array> {
  if (typeof source === "string") {
    yield* pieces(encoder.encode(source));
  } else if (source instanceof Uint8Array) {
    yield* pieces(source);
  } else if ("getReader" in source) {
    // The browser's ReadableStream is not async-iterable everywhere yet; its reader works in all runtimes.
    const reader = source.getReader();
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) return;
        yield* pieces(value);
      }
    } finally {
      reader.releaseLock();
    }
  } else {
    for await (const chunk of source) yield* pieces(typeof chunk === "string" ? encoder.encode(chunk) : chunk);
  }
}
