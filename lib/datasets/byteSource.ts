/**
 * The bytes of an uploaded file: a Web ReadableStream (fetch, Request.body, File.stream()), any async
 * iterable of chunks (a Node Readable), or the whole file when it is already in memory (tests, previews).
 */
export type ByteSource = ReadableStream<Uint8Array> | AsyncIterable<Uint8Array | string> | Uint8Array | string;

const encoder = new TextEncoder();

/** Yields the chunks of any {@link ByteSource} as bytes, in order, without collecting them. */
export async function* byteChunks(source: ByteSource): AsyncGenerator<Uint8Array> {
  if (typeof source === "string") {
    yield encoder.encode(source);
  } else if (source instanceof Uint8Array) {
    yield source;
  } else if ("getReader" in source) {
    // The browser's ReadableStream is not async-iterable everywhere yet; its reader works in all runtimes.
    const reader = source.getReader();
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) return;
        yield value;
      }
    } finally {
      reader.releaseLock();
    }
  } else {
    for await (const chunk of source) yield typeof chunk === "string" ? encoder.encode(chunk) : chunk;
  }
}
