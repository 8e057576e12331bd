/// Runs the development SMTP sink until SIGTERM/SIGINT (started by start.sh and test.sh).
import path from "node:path";
import { startMailSink } from "../mail/sink";

const port = Number(process.env.RINGSIDE_SMTP_PORT ?? 2525);
const dir = process.env.RINGSIDE_MAIL_DIR ?? path.join(process.cwd(), ".data", "mail");

startMailSink({ port, dir }).then(
  (server) => {
    console.error(`[ringside] SMTP sink on 127.0.0.1:${port}, storing messages in ${path.relative(process.cwd(), dir)}`);
    const stop = () => server.close(() => process.exit(0));
    process.on("SIGTERM", stop);
    process.on("SIGINT", stop);
  },
  (error: Error) => {
    console.error(`[ringside] SMTP sink could not listen on 127.0.0.1:${port}: ${error.message}`);
    process.exit(1);
  },
);
