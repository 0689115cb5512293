import type { MathNode } from 'mathjs';
import type { ReactNode } from 'react';
import { math } from '#shared/units';

// The Working's formulas are mathjs expressions over ASCII symbols (`m_dot_c`, `eta_c`, `T_2s`).
// Here they are drawn the way a student writes them: ṁ with subscripts, Greek letters, stacked
// fractions, superscript powers and a root sign, from the parsed expression tree (no TeX).

const GREEK: Record<string, string> = {
  eta: 'η',
  rho: 'ρ',
  gamma: 'γ',
  lambda: 'λ',
  eps: 'ε',
  epsilon: 'ε',
  pi: 'π',
  Delta: 'Δ',
  mu: 'μ',
  sigma: 'σ',
};

/** How a symbol reads: its letter (with a dot or Greek) and its subscript. */
export function symbolParts(name: string): { base: string; sub: string | null } {
  const parts = name.split('_');
  let base = parts.shift() ?? name;
  if (parts[0] === 'dot') {
    parts.shift();
    base = `${base}\u0307`; // combining dot above: ṁ
  }
  const difference = /^d([PpT])$/.exec(base);
  if (difference) base = `Δ${difference[1]}`;
  base = GREEK[base] ?? base;
  return { base, sub: parts.length > 0 ? parts.map((p) => GREEK[p] ?? p).join(',') : null };
}

export function MathSymbol({ name }: { name: string }) {
  const { base, sub } = symbolParts(name);
  return (
    <span className="whitespace-nowrap">
      <i className={base.length > 1 && !/^Δ/.test(base) ? 'not-italic' : ''}>{base}</i>
      {sub && <sub className="text-[0.7em] not-italic">{sub}</sub>}
    </span>
  );
}

type Node = MathNode & Record<string, unknown>;

function unwrap(node: Node): Node {
  return node.type === 'ParenthesisNode' ? unwrap(node.content as Node) : node;
}

function constantText(value: unknown): string {
  return typeof value === 'number' ? String(value) : String(value);
}

function render(node: Node, key: string): ReactNode {
  switch (node.type) {
    case 'SymbolNode':
      return <MathSymbol key={key} name={node.name as string} />;
    case 'ConstantNode':
      return <span key={key}>{constantText(node.value)}</span>;
    case 'ParenthesisNode':
      return <span key={key}>({render(node.content as Node, `${key}c`)})</span>;
    case 'OperatorNode': {
      const args = node.args as Node[];
      const op = node.op as string;
      if (node.fn === 'unaryMinus') return <span key={key}>−{render(args[0], `${key}a`)}</span>;
      if (node.fn === 'unaryPlus') return <span key={key}>+{render(args[0], `${key}a`)}</span>;
      if (op === '/') {
        return (
          <span key={key} className="mx-0.5 inline-flex flex-col items-center align-middle leading-tight">
            <span className="border-b border-current px-1 pb-px">{render(unwrap(args[0]), `${key}n`)}</span>
            <span className="px-1 pt-px">{render(unwrap(args[1]), `${key}d`)}</span>
          </span>
        );
      }
      if (op === '^') {
        return (
          <span key={key}>
            {render(args[0], `${key}b`)}
            <sup className="text-[0.75em]">{render(unwrap(args[1]), `${key}e`)}</sup>
          </span>
        );
      }
      const sign = op === '*' ? '·' : op === '-' ? '−' : op;
      return (
        <span key={key}>
          {render(args[0], `${key}l`)}
          <span className={op === '*' ? 'mx-0.5' : 'mx-1'}>{sign}</span>
          {render(args[1], `${key}r`)}
        </span>
      );
    }
    case 'FunctionNode': {
      const name = (node.fn as Node).name as string;
      const args = node.args as Node[];
      if (name === 'sqrt' && args.length === 1) {
        return (
          <span key={key} className="whitespace-nowrap">
            √<span className="border-t border-current px-0.5">{render(unwrap(args[0]), `${key}s`)}</span>
          </span>
        );
      }
      return (
        <span key={key}>
          {name}(
          {args.map((a, i) => (
            <span key={`${key}f${i}`}>
              {i > 0 && ', '}
              {render(a, `${key}f${i}`)}
            </span>
          ))}
          )
        </span>
      );
    }
    default:
      return <span key={key}>{node.toString()}</span>;
  }
}

/** The plain-text form of a formula, for screen readers and copying. */
export function formulaText(expression: string): string {
  return math.parse(expression).toString({ implicit: 'hide', parenthesis: 'auto' });
}

/**
 * A Working formula, `result = expression`, drawn from its mathjs expression. A formula that
 * does not parse is shown as written rather than breaking the panel.
 */
export function Formula({ expression, result }: { expression: string; result?: string }) {
  let body: ReactNode;
  let label: string;
  try {
    const node = math.parse(expression) as Node;
    body = render(node, 'f');
    label = formulaText(expression);
  } catch {
    body = <code>{expression}</code>;
    label = expression;
  }
  return (
    <span className="font-serif text-base text-ink" role="math" aria-label={result ? `${result} = ${label}` : label}>
      <span aria-hidden="true">
        {result && (
          <>
            <MathSymbol name={result} />
            <span className="mx-1.5">=</span>
          </>
        )}
        {body}
      </span>
    </span>
  );
}
