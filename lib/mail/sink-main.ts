import path from "node:path";
import { startMailSink } from "./sink";

// `npm run mail-sink`: the local SMTP sink npm start runs when SMTP_URL is unset.
const port = Number(process.env.LOCAL_SMTP_PORT ?? 2525);
const dir = path.resolve(process.env.ASSAY_MAIL_SINK_DIR ?? "var/mail");

startMailSink({ port, dir })
  .then((sink) => {
    console.log(`mail sink listening on smtp://127.0.0.1:${sink.port}, messages in ${dir}`);
    const stop = () => void sink.close().then(() => process.exit(0));
    process.on("SIGINT", stop);
    process.on("SIGTERM", stop);
  })
  .catch((err: NodeJS.ErrnoException) => {
    const why = err.code === "EADDRINUSE" ? `port ${port} is already in use (set LOCAL_SMTP_PORT)` : err.message;
    console.error(`[assay] mail sink: ${why}`);
    process.exit(1);
  });
