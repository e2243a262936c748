/**
 * JSON text as stored in a column (claim inputs, certificates), parsed. Text that is not JSON gives
 * `ifNotJson(text)`: the pages show nothing for it, while an export keeps the text for the checker to report.
 */
export function storedJson(text: string | null, ifNotJson: (text: string) => unknown = () => null): unknown {
  if (text === null) return null;
  try {
    return JSON.parse(text);
  } catch {
    return ifNotJson(text);
  }
}
