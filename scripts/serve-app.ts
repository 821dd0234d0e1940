import { createServer } from "node:http";
import next from "next";
import { env } from "@/lib/env";
import { clientAddress, trustedProxyList } from "@/lib/server/client-address";

// Serves the production build (like `next start`) on 127.0.0.1, but first replaces X-Forwarded-For with
// the one address the app may believe (lib/server/client-address.ts): the connection's peer, or, behind a
// proxy listed in TRUSTED_PROXIES, the client it forwarded for. better-auth keys its sign-in rate limit on
// that header, and `next start` passes a client-written one through untouched.
// Usage: tsx scripts/serve-app.ts <port>

const port = Number(process.argv[2]);
if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error("usage: tsx scripts/serve-app.ts <port>");
const hostname = "127.0.0.1";
const trusted = trustedProxyList(env.TRUSTED_PROXIES);

const app = next({ dev: false, dir: process.cwd(), hostname, port });
const handle = app.getRequestHandler();
await app.prepare();

const server = createServer((request, response) => {
  const forwarded = request.headers["x-forwarded-for"];
  const forwardedFor = Array.isArray(forwarded) ? forwarded.join(",") : forwarded;
  request.headers["x-forwarded-for"] = clientAddress(request.socket.remoteAddress ?? "", forwardedFor, trusted);
  void handle(request, response);
});
server.listen(port, hostname, () => console.log(`app: http://${hostname}:${port}`));

function stop(): void {
  server.close(() => process.exit(0));
  // Open keep-alive connections would hold close() forever.
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
