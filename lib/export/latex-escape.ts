/**
 * Making user strings safe inside a LaTeX document. Text is escaped character by character; math
 * ($…$, $$…$$) is passed through only after a whitelist check of every control word, every environment
 * and the brace structure, so that nothing a user types can read or write files, define macros, change
 * category codes or end the document. Unknown commands are shown, not run (`\backslash\mathrm{input}`);
 * math whose structure would not compile is printed verbatim instead.
 */

/** Characters that are not plain ASCII: math symbols as math, a few typographic ones as text commands. */
const UNICODE: Record<string, string> = {
  "√": "\\surd",
  "≤": "\\le",
  "≥": "\\ge",
  "≠": "\\ne",
  "≈": "\\approx",
  "∈": "\\in",
  "∉": "\\notin",
  "⊆": "\\subseteq",
  "⊇": "\\supseteq",
  "⊂": "\\subset",
  "⊃": "\\supset",
  "⊊": "\\subsetneq",
  "→": "\\to",
  "←": "\\leftarrow",
  "⇒": "\\Rightarrow",
  "⇔": "\\Leftrightarrow",
  "↦": "\\mapsto",
  "∞": "\\infty",
  "·": "\\cdot",
  "×": "\\times",
  "÷": "\\div",
  "±": "\\pm",
  "∓": "\\mp",
  "−": "-",
  "∑": "\\sum",
  "∏": "\\prod",
  "∫": "\\int",
  "∂": "\\partial",
  "∇": "\\nabla",
  "∀": "\\forall",
  "∃": "\\exists",
  "¬": "\\neg",
  "∧": "\\wedge",
  "∨": "\\vee",
  "∩": "\\cap",
  "∪": "\\cup",
  "∅": "\\emptyset",
  ℕ: "\\mathbb{N}",
  ℤ: "\\mathbb{Z}",
  ℚ: "\\mathbb{Q}",
  ℝ: "\\mathbb{R}",
  ℂ: "\\mathbb{C}",
  "≅": "\\cong",
  "≡": "\\equiv",
  "∼": "\\sim",
  "⌊": "\\lfloor",
  "⌋": "\\rfloor",
  "⌈": "\\lceil",
  "⌉": "\\rceil",
  "⟨": "\\langle",
  "⟩": "\\rangle",
  "∘": "\\circ",
  "⊕": "\\oplus",
  "⊗": "\\otimes",
  "∣": "\\mid",
  "∥": "\\parallel",
  "≪": "\\ll",
  "≫": "\\gg",
  "′": "'",
  "✓": "\\checkmark",
  "✗": "\\times",
  ℓ: "\\ell",
  α: "\\alpha",
  β: "\\beta",
  γ: "\\gamma",
  δ: "\\delta",
  ε: "\\varepsilon",
  ζ: "\\zeta",
  η: "\\eta",
  θ: "\\theta",
  ι: "\\iota",
  κ: "\\kappa",
  λ: "\\lambda",
  μ: "\\mu",
  ν: "\\nu",
  ξ: "\\xi",
  ο: "o",
  π: "\\pi",
  ρ: "\\rho",
  σ: "\\sigma",
  ς: "\\varsigma",
  τ: "\\tau",
  υ: "\\upsilon",
  φ: "\\varphi",
  χ: "\\chi",
  ψ: "\\psi",
  ω: "\\omega",
  Γ: "\\Gamma",
  Δ: "\\Delta",
  Θ: "\\Theta",
  Λ: "\\Lambda",
  Ξ: "\\Xi",
  Π: "\\Pi",
  Σ: "\\Sigma",
  Υ: "\\Upsilon",
  Φ: "\\Phi",
  Ψ: "\\Psi",
  Ω: "\\Omega",
};
/** Combining marks after a letter (D̃4 for the affine D4) become math accents. */
const COMBINING: Record<string, string> = { "\u0303": "tilde", "\u0302": "hat", "\u0304": "bar", "\u0307": "dot", "\u0301": "acute" };
const SUBSCRIPTS = "₀₁₂₃₄₅₆₇₈₉";
const SUPERSCRIPTS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const TEXT_UNICODE: Record<string, string> = {
  "–": "\\textendash{}",
  "—": "\\textemdash{}",
  "‘": "\\textquoteleft{}",
  "’": "\\textquoteright{}",
  "“": "\\textquotedblleft{}",
  "”": "\\textquotedblright{}",
  "…": "\\ldots{}",
  "•": "\\textbullet{}",
  "§": "\\S{}",
  "¶": "\\P{}",
  "©": "\\copyright{}",
  "°": "\\textdegree{}",
  "\u00a0": "~",
  "«": "\\guillemotleft{}",
  "»": "\\guillemotright{}",
};

/** A non-ASCII character as LaTeX (math symbols wrapped in \ensuremath so they work in text and math). */
function unicodeChar(ch: string): string {
  if (UNICODE[ch]) return UNICODE[ch].startsWith("\\") ? `\\ensuremath{${UNICODE[ch]}}` : UNICODE[ch];
  if (SUBSCRIPTS.includes(ch)) return `\\ensuremath{_{${SUBSCRIPTS.indexOf(ch)}}}`;
  if (SUPERSCRIPTS.includes(ch)) return `\\ensuremath{^{${SUPERSCRIPTS.indexOf(ch)}}}`;
  // The transpose and the exponent n of the reasons and input labels ("xᵀ(2I − A)x", "from xⁿ down to x⁰").
  if (ch === "ᵀ") return "\\ensuremath{^{\\mathsf{T}}}";
  if (ch === "ⁿ") return "\\ensuremath{^{n}}";
  if (TEXT_UNICODE[ch]) return `\\text{${TEXT_UNICODE[ch]}}`;
  const code = ch.codePointAt(0)!;
  // Latin-1 letters and Latin Extended-A are set up by LaTeX's utf8 input with T1 fonts.
  if ((code >= 0xc0 && code <= 0x17f) || (code >= 0xa1 && code <= 0xbf && code !== 0xac && code !== 0xb1)) return `\\text{${ch}}`;
  return `\\text{\\texttt{[U+${code.toString(16).toUpperCase().padStart(4, "0")}]}}`;
}

const TEXT_SPECIALS: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "{": "\\{",
  "}": "\\}",
  $: "\\$",
  "&": "\\&",
  "#": "\\#",
  "^": "\\textasciicircum{}",
  _: "\\_",
  "~": "\\textasciitilde{}",
  "%": "\\%",
  "<": "\\textless{}",
  ">": "\\textgreater{}",
  "|": "\\textbar{}",
  '"': "\\textquotedbl{}",
};

/** Control characters other than tab and newline are dropped before anything else. */
export function stripControl(s: string): string {
  return s.replace(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u2028\u2029]/g, "");
}

/**
 * Escapes text so that every character is printed as itself. The private placeholder pattern
 * \u0000…\u0000 used by the Markdown writer passes through untouched (control characters never
 * reach here from user input: callers strip them first).
 */
export function escapeText(s: string): string {
  let out = "";
  const chars = [...s];
  for (let k = 0; k < chars.length; k++) {
    const ch = chars[k];
    const accent = COMBINING[chars[k + 1]];
    if (accent && /^[A-Za-z0-9]$/.test(ch)) {
      out += `\\ensuremath{\\${accent}{${ch}}}`;
      k++;
    } else if (ch === "\u0000" || ch === "\n" || ch === "\t") out += ch === "\t" ? " " : ch;
    else if (TEXT_SPECIALS[ch]) out += TEXT_SPECIALS[ch];
    else if (ch.charCodeAt(0) < 0x80) out += ch;
    else if (TEXT_UNICODE[ch]) out += TEXT_UNICODE[ch];
    else {
      const u = unicodeChar(ch);
      out += u.startsWith("\\text{") ? u.slice(6, -1) : u;
    }
  }
  return out;
}

/** A one-line user string (title, name): control characters and line breaks removed, then escaped. */
export function escapeLine(s: string): string {
  return escapeText(
    stripControl(s)
      .replace(/[\r\n\t]+/g, " ")
      .replace(/\u0000/g, ""),
  );
}

/** Control words allowed in math: LaTeX, amsmath and amssymb only, none of which touch files or definitions. */
const MATH_WORDS = new Set(
  `
alpha beta gamma delta epsilon varepsilon zeta eta theta vartheta iota kappa lambda mu nu xi pi varpi rho varrho sigma varsigma
tau upsilon phi varphi chi psi omega Gamma Delta Theta Lambda Xi Pi Sigma Upsilon Phi Psi Omega
le leq ge geq ne neq leqslant geqslant approx sim simeq cong equiv propto subset subseteq supset supseteq subsetneq supsetneq
in notin ni cup cap setminus smallsetminus emptyset varnothing forall exists nexists neg lnot land lor wedge vee to mapsto
rightarrow leftarrow Rightarrow Leftarrow Leftrightarrow leftrightarrow longrightarrow longleftarrow Longrightarrow
Longleftrightarrow iff implies impliedby longmapsto hookrightarrow uparrow downarrow infty partial nabla cdot cdots ldots dots
dotsc dotsb dotsm vdots ddots times div pm mp circ bullet oplus otimes mid nmid parallel perp prec succ preceq succeq ll gg ast
star dagger prime langle rangle lfloor rfloor lceil rceil lvert rvert lVert rVert vert Vert backslash triangleq
sin cos tan cot sec csc arcsin arccos arctan sinh cosh tanh log ln lg exp det deg dim ker hom max min sup inf lim liminf limsup
gcd arg Pr mod bmod pmod pod
frac dfrac tfrac binom tbinom dbinom sqrt overline underline widehat widetilde hat tilde bar vec dot ddot check breve acute grave
mathring overbrace underbrace overrightarrow overleftarrow
mathrm mathbf mathit mathsf mathtt mathcal mathbb mathfrak boldsymbol operatorname text textrm textbf textit emph mbox
big Big bigg Bigg bigl bigr Bigl Bigr biggl biggr Biggl Biggr left right middle displaystyle textstyle scriptstyle quad qquad
sum prod int iint oint bigcup bigcap bigoplus bigotimes coprod limits nolimits substack stackrel overset underset not colon ell
hbar imath jmath Re Im aleph wp top bot angle triangle square Box checkmark sharp flat natural lhd rhd unlhd unrhd
begin end
`
    .split(/\s+/)
    .filter(Boolean),
);

const TEXT_GROUP_WORDS = new Set(["text", "textrm", "textbf", "textit", "emph", "mbox"]);
const MATH_ENVS = new Set(["matrix", "pmatrix", "bmatrix", "vmatrix", "Vmatrix", "smallmatrix", "cases", "aligned", "gathered", "split", "array"]);
/** The column spec of an array: an optional [t|c|b] position, then l, c, r and | only. */
const ARRAY_SPEC = /^\s*(\[[tcb]\]\s*)?\{[lcr|\s]+\}/;
const MAX_MATH_GROUPS = 64;
/** Control symbols (backslash + one non-letter) allowed in math. */
const MATH_SYMBOLS = new Set([",", ";", ":", "!", " ", "{", "}", "|", "%", "$", "#", "&", "_"]);

/**
 * Checks and rewrites one math formula (without its $ delimiters). Returns null when the formula's
 * structure could not compile or hides input tricks (unbalanced braces or environments, \left without
 * \right, a trailing backslash, TeX's ^^ character notation); the caller then prints it verbatim.
 */
export function sanitizeMath(src: string): string | null {
  const s = stripControl(src);
  if (s.includes("^^")) return null;
  let out = "";
  const groups: Array<"math" | "text"> = [];
  const envs: string[] = [];
  let lefts = 0;
  let nextGroupIsText = false;
  let i = 0;
  const inText = () => groups.includes("text");
  while (i < s.length) {
    const ch = s[i];
    if (ch === "\\") {
      const rest = s.slice(i + 1);
      const word = /^[A-Za-z]+/.exec(rest)?.[0];
      if (word) {
        i += 1 + word.length;
        if (!MATH_WORDS.has(word)) {
          out += `\\backslash\\mathrm{${word}}`;
          continue;
        }
        if (word === "begin" || word === "end") {
          const m = /^\{([A-Za-z]+\*?)\}/.exec(s.slice(i));
          if (!m || !MATH_ENVS.has(m[1])) return null;
          if (word === "begin") envs.push(m[1]);
          else if (envs.pop() !== m[1]) return null;
          out += `\\${word}{${m[1]}}`;
          i += m[0].length;
          if (word === "begin" && m[1] === "array") {
            // Column specs: only l, c, r and rules. amsmath's array does not know >{…}, p{…}, @{…} or *{…}:
            // pdflatex stops on them ("Illegal pream-token") and the whole document fails.
            const spec = ARRAY_SPEC.exec(s.slice(i));
            if (!spec) return null;
            out += spec[0].replace(/\s+/g, "");
            i += spec[0].length;
          }
          continue;
        }
        if (word === "left") lefts++;
        if (word === "right") lefts--;
        if (lefts < 0) return null;
        nextGroupIsText = TEXT_GROUP_WORDS.has(word);
        // A space keeps a following letter from joining the control word.
        out += `\\${word}` + (/^[A-Za-z]/.test(s.slice(i)) ? " " : "");
        continue;
      }
      const sym = rest[0];
      if (sym === undefined) return null;
      i += 2;
      if (sym === "\\") {
        if (envs.length === 0) {
          out += " ";
          continue;
        }
        out += "\\\\";
      } else if (MATH_SYMBOLS.has(sym)) out += `\\${sym}`;
      else out += `\\backslash ${sym.charCodeAt(0) < 0x80 ? escapeMathChar(sym, inText()) : unicodeChar(sym)}`;
      nextGroupIsText = false;
      continue;
    }
    i++;
    if (ch === "{") {
      // TeX allows 255 levels of grouping in all; a formula this deep is an attack, not mathematics.
      if (groups.length >= MAX_MATH_GROUPS) return null;
      groups.push(nextGroupIsText ? "text" : "math");
      nextGroupIsText = false;
      out += "{";
      continue;
    }
    nextGroupIsText = false;
    if (ch === "}") {
      if (groups.pop() === undefined) return null;
      out += "}";
    } else if (ch === "&") out += envs.length ? "&" : "\\&";
    else if (ch.charCodeAt(0) >= 0x80 || (ch >= "\ud800" && ch <= "\udfff")) {
      const cp = s.codePointAt(i - 1)!;
      const full = String.fromCodePoint(cp);
      if (full.length === 2) i++;
      out += unicodeChar(full);
    } else out += escapeMathChar(ch, inText());
  }
  if (groups.length || envs.length || lefts !== 0) return null;
  return out;
}

function escapeMathChar(ch: string, text: boolean): string {
  if (ch === "%" || ch === "#" || ch === "$") return `\\${ch}`;
  if (text && ch === "^") return "\\textasciicircum{}";
  if (text && ch === "_") return "\\_";
  if (text && (ch === "<" || ch === ">" || ch === "|")) return TEXT_SPECIALS[ch];
  if (ch === "\n" || ch === "\r" || ch === "\t") return " ";
  return ch;
}
