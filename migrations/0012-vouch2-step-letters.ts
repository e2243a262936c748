/**
 * Step labels change from "3.2.1:1" to "3.2.1(a)" (lib/proof-tree.ts). Pages, exports and the timeline
 * compute labels at read time, so the only stored copies are the words of in-app notifications
 * ("Your vouch for step 2.1:1 (case 2.1, …) …"); they are rewritten here, and back on the way down.
 * Outgoing mail keeps the words it was sent with: it is a record of what left the house.
 *
 * The conversion is written out here rather than imported, so that this migration keeps meaning what
 * it meant when later code changes the format again.
 */
import { QueryTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const MESSAGE_LENGTH = 500; // notifications.message is VARCHAR(500)

/** Bijective base 26, as lib/proof-tree.ts had it when this migration was written: 1 → a, 27 → aa. */
const letters = (place: number): string => {
  let out = "";
  for (let n = place; n > 0; n = Math.floor((n - 1) / 26)) out = String.fromCharCode(97 + ((n - 1) % 26)) + out;
  return out;
};
const place = (text: string): number => [...text].reduce((n, ch) => n * 26 + (ch.charCodeAt(0) - 96), 0);

const OLD = /\b([Ss]tep) (\d+(?:\.\d+)*):(\d{1,6})\b/g;
const NEW = /\b([Ss]tep) (\d+(?:\.\d+)*)\(([a-z]{1,6})\)/g;

/** "step 2.1:3" → "step 2.1(c)" wherever a notification names a step. */
export const toLetters = (message: string): string =>
  message.replace(OLD, (all, word: string, c: string, p: string) => (Number(p) >= 1 ? `${word} ${c}(${letters(Number(p))})` : all));
/** "step 2.1(c)" → "step 2.1:3", for down(). */
export const toColons = (message: string): string => message.replace(NEW, (_all, word: string, c: string, l: string) => `${word} ${c}:${place(l)}`);

const fit = (text: string) => (text.length <= MESSAGE_LENGTH ? text : `${text.slice(0, MESSAGE_LENGTH - 1)}…`);

async function rewrite(qi: QueryInterface, like: string, convert: (m: string) => string) {
  const sq = qi.sequelize;
  let after = 0;
  for (;;) {
    const rows = await sq.query<{ id: number; message: string }>(
      "SELECT id, message FROM notifications WHERE id > ? AND message REGEXP ? ORDER BY id LIMIT 500",
      { replacements: [after, like], type: QueryTypes.SELECT },
    );
    if (rows.length === 0) return;
    for (const r of rows) {
      const next = fit(convert(r.message));
      if (next !== r.message) await sq.query("UPDATE notifications SET message = ? WHERE id = ?", { replacements: [next, r.id] });
    }
    after = Number(rows[rows.length - 1].id);
  }
}

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await rewrite(qi, "[Ss]tep [0-9.]+:[0-9]", toLetters);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await rewrite(qi, "[Ss]tep [0-9.]+\\([a-z]+\\)", toColons);
}
