/**
 * Cairn's one way of showing a verdict or a state: a glyph of its own and the word in small capitals, in the
 * state's colour. Shape and word carry the meaning; colour only repeats it. Every mark component (verdict, case
 * state, proof state, dispute state, vouch) renders through this.
 */
export function Mark({ glyph, word, tone, data, pulse = false }: { glyph: string; word: string; tone: string; data: Record<string, string>; pulse?: boolean }) {
  return (
    <span className={`mark inline-flex shrink-0 items-baseline gap-1 whitespace-nowrap ${tone}`} {...data}>
      <span aria-hidden="true" className={`mark-glyph${pulse ? " animate-pulse" : ""}`}>
        {glyph}
      </span>
      <span className="mark-word">{word}</span>
    </span>
  );
}

/** How one value of a verdict or state looks: its glyph, its colour class, and whether the glyph pulses (work under way). */
export interface MarkLook {
  glyph: string;
  tone: string;
  pulse?: boolean;
}

/**
 * The mark of one value of a kind of state, read from the kind's table of looks: the word is the value itself, and the
 * data attribute (e.g. `data-verdict`) carries it for tests and styles.
 */
export function LookMark<V extends string>({ looks, value, attribute }: { looks: Record<V, MarkLook>; value: V; attribute: `data-${string}` }) {
  return <Mark {...looks[value]} word={value} data={{ [attribute]: value }} />;
}
