/** The app's pages as the file tree has them ("/proofs/[proofId]/steps/[stepId]"), so that a new page cannot be missed by the browser tests. */
import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";

export function pageRoutes(dir = "app"): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return pageRoutes(path);
    if (name !== "page.tsx") return [];
    const route =
      "/" +
      relative("app", dir)
        .split("/")
        .filter((seg) => !/^\(.*\)$/.test(seg))
        .join("/");
    return [route === "/" ? "/" : route.replace(/\/$/, "")];
  });
}
