import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { LinkedText } from "@/components/ui/linked-text";

describe("LinkedText (the admin mail view)", () => {
  it("makes an invitation link clickable and leaves the sentence's full stop outside it", () => {
    const html = renderToStaticMarkup(<LinkedText text={"Open this link:\nhttp://localhost:3000/invitations/AbC_-9.\nThanks"} />);
    expect(html).toContain(
      '<a href="http://localhost:3000/invitations/AbC_-9" class="text-lichen-700 underline" rel="noreferrer">http://localhost:3000/invitations/AbC_-9</a>.',
    );
  });
  it("links nothing that is not http(s) and escapes markup in the text", () => {
    const html = renderToStaticMarkup(<LinkedText text={"javascript:alert(1) <b>x</b> ftp://example.org"} />);
    expect(html).not.toContain("<a");
    expect(html).toContain("&lt;b&gt;x&lt;/b&gt;");
  });
});
