/**
 * Typesetting of result symbols and numbers without a math renderer (the what-if island must
 * stay small): the block language's simple LaTeX (`y_2`, `\mathrm{Fr}_1`, `\Delta E`) as
 * italic letters with sub- and superscripts, and numbers with true minus signs and
 * `× 10ⁿ` instead of `e+n`.
 */
import type { ReactNode } from 'react';

/** A piece of a typeset symbol. */
export type SymbolPart =
  | { readonly type: 'var'; readonly text: string }
  | { readonly type: 'text'; readonly text: string }
  | { readonly type: 'sub' | 'sup'; readonly parts: readonly SymbolPart[] };

const COMMANDS: Readonly<Record<string, SymbolPart>> = {
  Delta: { type: 'text', text: 'Δ' },
  rho: { type: 'var', text: 'ρ' },
  varepsilon: { type: 'var', text: 'ε' },
  epsilon: { type: 'var', text: 'ϵ' },
  min: { type: 'text', text: 'min' },
  max: { type: 'text', text: 'max' },
};

/**
 * Parts of a simple LaTeX symbol; null when it uses anything beyond letters, digits,
 * `_`, `^`, braces, `\mathrm{}`, `\text{}` and a few Greek letters (show the plain symbol then).
 */
export function symbolParts(latex: string): SymbolPart[] | null {
  let i = 0;
  const group = (closing: boolean): SymbolPart[] | null => {
    const parts: SymbolPart[] = [];
    const push = (type: 'var' | 'text', text: string) => {
      const last = parts[parts.length - 1];
      if (last && last.type === type) parts[parts.length - 1] = { type, text: last.text + text };
      else parts.push({ type, text });
    };
    while (i < latex.length) {
      const c = latex[i]!;
      if (c === '}') {
        if (!closing) return null;
        i += 1;
        return parts;
      }
      if (c === '{') {
        i += 1;
        const inner = group(true);
        if (!inner) return null;
        parts.push(...inner);
      } else if (c === '\\') {
        const name = /^\\([A-Za-z]+)/.exec(latex.slice(i))?.[1];
        if (!name) return null;
        i += name.length + 1;
        // As in TeX, a space after a control word only ends the word.
        if (latex[i] === ' ') i += 1;
        if (name === 'mathrm' || name === 'text') {
          const body = /^\{([^{}]*)\}/.exec(latex.slice(i));
          if (!body) return null;
          i += body[0].length;
          push('text', body[1]!);
        } else if (COMMANDS[name]) {
          const part = COMMANDS[name]! as { type: 'var' | 'text'; text: string };
          push(part.type, part.text);
        } else {
          return null;
        }
      } else if (c === '_' || c === '^') {
        i += 1;
        let inner: SymbolPart[] | null;
        if (latex[i] === '{') {
          i += 1;
          inner = group(true);
        } else if (i < latex.length && latex[i] !== '}') {
          inner = group1();
        } else {
          return null;
        }
        if (!inner) return null;
        parts.push({ type: c === '_' ? 'sub' : 'sup', parts: inner });
      } else {
        i += 1;
        if (/[A-Za-z]/.test(c)) push('var', c);
        else push('text', c === '-' ? '−' : c);
      }
    }
    return closing ? null : parts;
  };
  // One character (or one command) after `_` / `^` without braces.
  const group1 = (): SymbolPart[] | null => {
    const c = latex[i]!;
    if (c === '\\') {
      const name = /^\\([A-Za-z]+)/.exec(latex.slice(i))?.[1];
      const part = name ? COMMANDS[name] : undefined;
      if (!name || !part) return null;
      i += name.length + 1;
      return [part];
    }
    i += 1;
    return [{ type: /[A-Za-z]/.test(c) ? 'var' : 'text', text: c }];
  };
  return typeof latex === 'string' && latex !== '' ? group(false) : null;
}

function render(parts: readonly SymbolPart[], key = ''): ReactNode[] {
  return parts.map((p, k) => {
    const id = `${key}${k}`;
    if (p.type === 'var') return <i key={id}>{p.text}</i>;
    if (p.type === 'text') return <span key={id}>{p.text}</span>;
    const Tag = p.type;
    return <Tag key={id}>{render(p.parts, `${id}.`)}</Tag>;
  });
}

/** A result symbol in reading form (`y₂` with an italic y); the plain symbol when the LaTeX is unusual. */
export function SymbolText({ latex, symbol }: { readonly latex: string; readonly symbol: string }) {
  const parts = symbolParts(latex);
  return <span className="whitespace-nowrap font-serif">{parts ? render(parts) : symbol}</span>;
}

const SUPERSCRIPT: Readonly<Record<string, string>> = { '-': '⁻', '+': '', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** A formatted number for people: `-0.2250` → `−0.2250`, `1.235e+8` → `1.235 × 10⁸`. Other text unchanged. */
export function displayNumber(text: string): string {
  const m = /^(-?)(\d+(?:\.\d+)?)e([+-]?\d+)$/.exec(text);
  if (m) {
    const exponent = [...m[3]!].map((c) => SUPERSCRIPT[c] ?? c).join('');
    return `${m[1] ? '−' : ''}${m[2]} × 10${exponent}`;
  }
  return /^-\d/.test(text) ? `−${text.slice(1)}` : text;
}
