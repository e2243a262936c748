/**
 * Input refused at a place inside it: `path` is the JSON path of the offending value (e.g. `$.claims[2].graph.format`,
 * `$.and[1].value`) and `detail` says what is wrong there. Claims and case conditions refuse their input this way.
 */
export class JsonPathError extends Error {
  constructor(
    readonly path: string,
    readonly detail: string,
  ) {
    super(`${path}: ${detail}`);
  }
}
