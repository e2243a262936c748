/**
 * `tsx scripts/mail-fake.ts`: a local SMTP server on 127.0.0.1 that accepts every message and keeps it,
 * one JSON line each, in .data/mail/ (see lib/mail/store.ts). Started by `npm start` and `npm test` so the
 * invitation flow can be followed without a real mail provider. Port: CAIRN_SMTP_PORT (default 2525).
 */
import { appendFileSync, mkdirSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { SMTPServer } from "smtp-server";
import { mailStorePath, parseRawMail } from "../lib/mail/store";
import { readEnv } from "../lib/env";

const port = readEnv().CAIRN_SMTP_PORT;
const file = mailStorePath();
mkdirSync(path.dirname(file), { recursive: true });

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "Cairn mail fake",
  size: 5 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", () => {
      const raw = Buffer.concat(chunks).toString("utf8");
      const { subject, text } = parseRawMail(raw);
      const record = {
        id: randomUUID(),
        receivedAt: new Date().toISOString(),
        from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
        to: session.envelope.rcptTo.map((r) => r.address),
        subject,
        text,
      };
      appendFileSync(file, `${JSON.stringify(record)}\n`);
      callback();
    });
  },
});

server.on("error", (e) => console.error(`[mail-fake] ${e.message}`));
server.listen(port, "127.0.0.1", () => console.log(`[mail-fake] listening on 127.0.0.1:${port}, storing in ${file}`));
const stop = () => server.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
