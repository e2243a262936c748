import { describe, expect, it } from "vitest";
import { parseRawMail } from "./store";

describe("reading a captured message", () => {
  it("decodes a quoted-printable UTF-8 body with soft line breaks and an encoded subject", () => {
    const raw = [
      "From: Cairn <no-reply@cairn.localhost>",
      "Subject: =?UTF-8?Q?[Cairn]_Dov_invites_you_to_review_=E2=80=9CTrees=E2=80=9D?=",
      "Content-Type: text/plain; charset=utf-8",
      "Content-Transfer-Encoding: quoted-printable",
      "",
      "Review case 3.2 of =E2=80=9CTrees with spectral radius in (2, =E2=88=9A(2+=E2=88=9A5)]=E2=80=9D:",
      "http://localhost:3122/invitations/AbCdEfGhIjKlMnOpQrStUvWxYz0123456789-_abcdef=",
      "ghij",
      "",
    ].join("\r\n");
    const mail = parseRawMail(raw);
    expect(mail.subject).toBe("[Cairn] Dov invites you to review “Trees”");
    expect(mail.text).toContain("“Trees with spectral radius in (2, √(2+√5)]”");
    expect(mail.text).toContain("/invitations/AbCdEfGhIjKlMnOpQrStUvWxYz0123456789-_abcdefghij\n");
  });

  it("decodes base64 and passes 7bit through", () => {
    const b64 = ["Subject: plain", "Content-Transfer-Encoding: base64", "", Buffer.from("ρ(G) < 2").toString("base64")].join("\r\n");
    expect(parseRawMail(b64).text).toBe("ρ(G) < 2");
    expect(parseRawMail("Subject: hi\r\n\r\nline one\r\nline two").text).toBe("line one\nline two");
  });
});
