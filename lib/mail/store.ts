/**
 * The local mail fake's store: one JSON line per received message, under .data/mail/. Read by the admin
 * page and by tests; written only by scripts/mail-fake.ts. Only plain-text messages are decoded (that is
 * all Cairn sends).
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { readEnv } from "@/lib/env";

export interface CapturedMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

// A data file written at run time, not a source of the app: the ignore comment keeps the bundler from tracing
// the whole project because of a path made from the working directory and a variable.
export const mailStorePath = () =>
  readEnv().CAIRN_MAIL_STORE ?? path.join(/* turbopackIgnore: true */ process.cwd(), ".data", "mail", `messages-${readEnv().CAIRN_SMTP_PORT}.jsonl`);

function decodeQuotedPrintable(s: string): string {
  const bytes: number[] = [];
  const soft = s.replace(/=\r?\n/g, "");
  for (let i = 0; i < soft.length; i++) {
    if (soft[i] === "=" && /^[0-9A-F]{2}$/i.test(soft.slice(i + 1, i + 3))) {
      bytes.push(parseInt(soft.slice(i + 1, i + 3), 16));
      i += 2;
    } else bytes.push(...Buffer.from(soft[i], "utf8"));
  }
  return Buffer.from(bytes).toString("utf8");
}

function decodeHeader(value: string): string {
  return value.replace(/=\?utf-8\?([BQ])\?([^?]*)\?=\s*/gi, (_m, enc: string, text: string) =>
    enc.toUpperCase() === "B" ? Buffer.from(text, "base64").toString("utf8") : decodeQuotedPrintable(text.replace(/_/g, " ")),
  );
}

/** Splits a raw RFC 5322 message into the subject and the decoded plain-text body. */
export function parseRawMail(raw: string): { subject: string; text: string } {
  const cut = raw.search(/\r?\n\r?\n/);
  const head = (cut < 0 ? raw : raw.slice(0, cut)).replace(/\r?\n[ \t]+/g, " ");
  const body = cut < 0 ? "" : raw.slice(cut).replace(/^\r?\n\r?\n/, "");
  const header = (name: string) =>
    head
      .split(/\r?\n/)
      .find((l) => l.toLowerCase().startsWith(`${name}:`))
      ?.slice(name.length + 1)
      .trim() ?? "";
  const encoding = header("content-transfer-encoding").toLowerCase();
  const text = encoding === "quoted-printable" ? decodeQuotedPrintable(body) : encoding === "base64" ? Buffer.from(body, "base64").toString("utf8") : body;
  return { subject: decodeHeader(header("subject")), text: text.replace(/\r\n/g, "\n") };
}

/** Every captured message, newest first. */
export function readCapturedMail(file = mailStorePath()): CapturedMail[] {
  if (!existsSync(/* turbopackIgnore: true */ file)) return [];
  return readFileSync(/* turbopackIgnore: true */ file, "utf8")
    .split("\n")
    .filter((l) => l.trim())
    .map((l) => JSON.parse(l) as CapturedMail)
    .reverse();
}
