/**
 * Sessions end (issue 10, defect 9), at the level every handler shares (lib/session.ts): a session token
 * whose version is older than the person's is no session (401), and removal from a proof ends that
 * proof's access at the next request, because membership is read from the database on each request,
 * not from the token. The browser-level test with real cookies is tests/e2e/session-end.test.ts.
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { getServerSession, type Session } from "next-auth";
import { encode } from "next-auth/jwt";
import { authOptions } from "@/lib/auth";
import { actAs, params } from "./helpers";
import { reviewProofsForFile } from "./review-fixtures";
import { endSessions } from "@/lib/data/users";
import { models } from "@/models";
import * as proofsRoute from "@/app/api/proofs/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";

const [fx] = reviewProofsForFile(["session end"]);

const list = () => proofsRoute.GET(new Request("http://localhost/api/proofs"), params({}));
const readProof = () => proofRoute.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId) }));

describe("session version", () => {
  it("a token of an older version, or without one, is no session: 401", async () => {
    const id = (await actAs("coauthor"))!;
    expect((await list()).status).toBe(200);
    const session = (await vi.mocked(getServerSession)()) as Session;
    await endSessions(id); // what sign-out and a password change do
    const stale = await list();
    expect(stale.status).toBe(401);
    expect((await stale.json()).error.code).toBe("unauthenticated");
    // A token minted before versions existed carries none.
    vi.mocked(getServerSession).mockResolvedValue({ ...session, user: { ...session.user, sessionVersion: undefined } });
    expect((await list()).status).toBe(401);
    await actAs("coauthor"); // a new sign-in carries the new version
    expect((await list()).status).toBe(200);
  });

  it("ending one version twice changes nothing the second time (a replayed sign-out of an old token)", async () => {
    const id = (await actAs("outsider"))!;
    const { sessionVersion } = (await models().User.findByPk(id))!;
    await endSessions(id, sessionVersion);
    await endSessions(id, sessionVersion);
    expect((await models().User.findByPk(id))!.sessionVersion).toBe(sessionVersion + 1);
  });
});

describe("removal from a proof", () => {
  it("ends that proof's access at the next request of the same session; other proofs are untouched", async () => {
    await actAs("reviewer");
    expect((await readProof()).status).toBe(200);
    const step = () => stepRoute.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId), stepId: String(fx.steps["1.1"]) }));
    expect((await step()).status).toBe(200);
    await models().ProofMember.destroy({ where: { proofId: fx.proofId, userId: fx.ids.reviewer } });
    expect((await readProof()).status).toBe(403);
    expect((await step()).status).toBe(403);
    expect((await list()).status).toBe(200);
    await models().ProofMember.create({ proofId: fx.proofId, userId: fx.ids.reviewer, role: "reviewer" });
  });
});

describe("next-auth's own session endpoint (GET /api/auth/session, what the browser's useSession reads)", () => {
  const secret = "a secret for the session endpoint test";
  /**
   * Runs next-auth's session action (the one behind GET /api/auth/session and getServerSession) on a cookie signed as
   * the app signs it, with the app's callbacks: the real getServerSession (this file mocks the import) in its
   * request/response form, which hands back the session body and the cookies it sets.
   */
  async function sessionEndpoint(token: Record<string, unknown>) {
    const real = (await vi.importActual<typeof import("next-auth")>("next-auth")).getServerSession;
    const cookie = await encode({ token, secret });
    const headers = new Map<string, string[]>();
    const res = {
      getHeader: (name: string) => headers.get(name.toLowerCase()),
      setHeader: (name: string, value: string | string[]) => headers.set(name.toLowerCase(), ([] as string[]).concat(value)),
    };
    const req = { headers: { host: "localhost" }, cookies: { "next-auth.session-token": cookie } };
    const session = (await real(req as never, res as never, { ...authOptions, secret })) as { user?: { email?: string } } | null;
    const cleared = (headers.get("set-cookie") ?? []).some((c) => /^next-auth\.session-token=;/.test(c) && /max-age=0/i.test(c));
    return { session, cleared };
  }

  it("answers the person for a current version, and an empty session that clears the cookie once the version is ended", async () => {
    const id = (await actAs("editor"))!;
    const { sessionVersion, email } = (await models().User.findByPk(id))!;
    const token = { sub: String(id), email, name: "Dov", role: "member", sv: sessionVersion };
    const live = await sessionEndpoint(token);
    expect(live.session?.user?.email).toBe(email);
    expect(live.cleared).toBe(false);
    await endSessions(id, sessionVersion); // what sign-out does
    // Before the fix the endpoint decoded the cookie and answered its user until the JWT expired (8 h).
    const ended = await sessionEndpoint(token);
    expect(ended.session).toBeNull();
    expect(ended.cleared).toBe(true);
    // A token without a version (minted before versions existed) is no session either.
    expect((await sessionEndpoint({ sub: String(id), email })).session).toBeNull();
  });
});
