/// The production web server (npm start, npm test): Next.js's request handler behind a
/// plain node:http server, so that the client's address comes from the socket
/// (lib/http/client-address.ts) rather than from a header the client wrote.
/// Usage: node --import tsx lib/ops/web-server.ts --host 127.0.0.1 --port 3000
import { createServer } from "node:http";
import path from "node:path";
import next from "next";
import { CLIENT_ADDRESS_HEADER, markClientAddressResolved, parseTrustedProxies, resolveClientAddress } from "../http/client-address";

function option(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback;
}

const host = option("host", "127.0.0.1");
const port = Number(option("port", process.env.PORT ?? "3000"));
const trusted = parseTrustedProxies(process.env.RINGSIDE_TRUSTED_PROXIES);

async function main(): Promise<void> {
  markClientAddressResolved();
  const app = next({ dev: false, hostname: host, port, dir: path.resolve(__dirname, "../..") });
  const handle = app.getRequestHandler();
  await app.prepare();
  const server = createServer((req, res) => {
    req.headers[CLIENT_ADDRESS_HEADER] = resolveClientAddress(req.socket.remoteAddress, req.headers["x-forwarded-for"], trusted);
    handle(req, res).catch((error: unknown) => {
      console.error("[ringside] request failed outside every route:", error);
      if (!res.headersSent) res.writeHead(500, { "Content-Type": "application/json" });
      res.end('{"error":{"code":"internal","message":"Something went wrong on the server."}}');
    });
  });
  server.listen(port, host, () => console.error(`[ringside] web server on http://${host}:${port}`));
  const stop = () => {
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

main().catch((error: Error) => {
  console.error(`[ringside] the web server could not start: ${error.message}`);
  process.exit(1);
});
