import type { MathNode } from 'mathjs';
import { Fragment, type ReactNode } from 'react';
import { math } from '../../../../shared/units';

// The Working's formulas are mathjs expressions over ASCII symbols (`m_dot_c`, `rho_man`); this
// draws them the way they are written on paper: ṁ with a subscript c, ρ with a subscript man.

const GREEK: Record<string, string> = {
  eta: 'η',
  rho: 'ρ',
  gamma: 'γ',
  eps: 'ε',
  pi: 'π',
  lambda: 'λ',
};

/** A symbol name as written on paper: its letter (Greek, Δ, ṁ) and its subscript. */
export function symbolParts(name: string): { base: string; subscript: string | null } {
  let rest = name;
  let base: string;
  if (rest.startsWith('m_dot')) {
    base = 'ṁ';
    rest = rest.slice('m_dot'.length).replace(/^_/, '');
  } else if (/^d[pPT]_/.test(rest)) {
    // dp_in, dT_in, dP_inj: a difference.
    base = `Δ${rest[1]}`;
    rest = rest.slice(3);
  } else {
    const [head, ...tail] = rest.split('_');
    base = GREEK[head] ?? head;
    rest = tail.join('_');
  }
  const subscript = rest ? rest.split('_').join(',') : null;
  return { base, subscript };
}

export function MathSymbol({ name }: { name: string }) {
  const { base, subscript } = symbolParts(name);
  return (
    <span className="italic">
      {base}
      {subscript && <sub className="not-italic text-[0.75em]">{subscript}</sub>}
    </span>
  );
}

const OPERATOR_TEXT: Record<string, string> = { '*': '·', '/': '/', '+': '+', '-': '−' };

function render(node: MathNode): ReactNode {
  switch (node.type) {
    case 'SymbolNode': {
      const name = (node as unknown as { name: string }).name;
      return <MathSymbol name={name} />;
    }
    case 'ConstantNode':
      return <span>{String((node as unknown as { value: unknown }).value)}</span>;
    case 'ParenthesisNode':
      return <>({render((node as unknown as { content: MathNode }).content)})</>;
    case 'FunctionNode': {
      const f = node as unknown as { fn: { name: string }; args: MathNode[] };
      if (f.fn.name === 'sqrt') return <>√({render(f.args[0])})</>;
      return (
        <>
          {f.fn.name}(
          {f.args.map((a, i) => (
            <Fragment key={i}>
              {i > 0 && ', '}
              {render(a)}
            </Fragment>
          ))}
          )
        </>
      );
    }
    case 'OperatorNode': {
      const o = node as unknown as { op: string; fn: string; args: MathNode[] };
      if (o.args.length === 1) return <>{o.op === '-' ? '−' : o.op}{render(o.args[0])}</>;
      if (o.op === '^') {
        return (
          <>
            {render(o.args[0])}
            <sup className="text-[0.75em]">{render(o.args[1])}</sup>
          </>
        );
      }
      return (
        <>
          {render(o.args[0])} {OPERATOR_TEXT[o.op] ?? o.op} {render(o.args[1])}
        </>
      );
    }
    default:
      return <span>{node.toString()}</span>;
  }
}

/** `result = formula`, drawn from the Working's mathjs expression; the plain text stays readable to screen readers. */
export function Formula({ result, formula }: { result: string; formula: string }) {
  let body: ReactNode;
  try {
    body = render(math.parse(formula));
  } catch {
    body = <span>{formula}</span>;
  }
  return (
    <p className="font-serif text-lg leading-relaxed text-ink" aria-label={`${result} = ${formula}`}>
      <span aria-hidden="true">
        <MathSymbol name={result} /> = {body}
      </span>
    </p>
  );
}
