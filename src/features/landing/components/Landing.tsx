import { Link, useNavigate } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Button, ButtonLink } from '#src/components/Button';
import { useDocumentTitle } from '#src/components/Page';
import { useDemoSignIn } from '../api/demo-sign-in';
import { isApiError } from '#src/lib/api-client';
import { homeAfterSignIn, paths } from '#src/lib/paths';
import { useDemoAvailable } from '#src/lib/session';

/** What a study answers, in the order a builder asks. */
const QUESTIONS = [
  {
    title: 'Does the compressor fit?',
    text: 'Every rpm and boost target becomes a point on the compressor map, with its distance from surge, from choke and from the wheel’s speed limit, and a verdict per plan.',
  },
  {
    title: 'Can the turbine make that boost?',
    text: 'The exhaust side finds the boost each turbine holds, where full boost arrives, the pressure it puts back on the engine and the wastegate size it needs.',
  },
  {
    title: 'Will the fuel keep up?',
    text: 'Injector duty and pump flow on petrol, an ethanol blend or methanol, with lean mixtures under boost called out.',
  },
  {
    title: 'On a hot day, at altitude?',
    text: 'Scenarios change the air and the boost schedule (by gear, at part throttle), and every plan is judged in each of them.',
  },
];

/** Three steps of working with a study. */
const STEPS = [
  'Enter the engine, its fuel system and the boost you want, rpm by rpm.',
  'Add the plans you are choosing between: a compressor map each from the team’s library, and the turbine side if you want it.',
  'Read the verdicts, open the Working of any point to follow every step with its formula and source, and save the study for the team.',
];

/**
 * The signed-out home: what Spoolbook does, in a few plain sentences, with the demo one click
 * away (a development server signs straight into the demo account; elsewhere, sign up).
 */
export function Landing() {
  useDocumentTitle('Spoolbook: turbocharger matching worked out in the open');
  const navigate = useNavigate();
  const demoAvailable = useDemoAvailable();
  const demo = useDemoSignIn();

  return (
    <div className="mx-auto max-w-5xl space-y-10">
      <section aria-labelledby="landing-title" className="space-y-4 pt-4">
        <p className="text-xs font-semibold uppercase tracking-[0.14em] text-copper-ink">For people who build turbocharged engines</p>
        <h1 id="landing-title" className="max-w-3xl text-4xl font-semibold tracking-tight text-ink sm:text-5xl">
          Know the turbo fits before you buy it.
        </h1>
        <p className="max-w-3xl text-lg text-ink-soft">
          Spoolbook checks a turbocharger, its housings and the fuel system against the engine you are building: the airflow at every rpm and boost target
          against the compressor map, the turbine’s boost, the injectors and the pump, on a hot day and at altitude. Every number shows how it was worked out,
          and every study stays in your team’s library.
        </p>
        <div className="flex flex-wrap items-center gap-3">
          {demoAvailable === null ? (
            <Button variant="primary" pending data-testid="open-demo">
              Open the demo
            </Button>
          ) : demoAvailable ? (
            <Button
              variant="primary"
              pending={demo.isPending}
              onClick={() => demo.mutate(undefined, { onSuccess: () => navigate(homeAfterSignIn) })}
              data-testid="open-demo"
            >
              Open the demo
            </Button>
          ) : (
            <ButtonLink to={paths.signUp.href()} variant="primary" data-testid="open-demo">
              Create an account to try the demo
            </ButtonLink>
          )}
          <ButtonLink to={paths.signIn.href()}>Sign in</ButtonLink>
        </div>
        {demoAvailable ? (
          <p className="text-sm text-ink-soft">The demo signs you in as the owner of the demo team, whose studies judge an invented hill-climb engine.</p>
        ) : (
          demoAvailable === false && (
            <p className="text-sm text-ink-soft">
              A new account starts with a team of its own; “New study” there starts from the demo hill-climb study or blank.
            </p>
          )
        )}
        {demo.isError && <Alert tone="error">{isApiError(demo.error) ? demo.error.message : 'The demo could not be opened. Try again.'}</Alert>}
      </section>

      <section aria-labelledby="landing-questions" className="space-y-4">
        <h2 id="landing-questions" className="text-2xl font-semibold text-ink">
          What a study answers
        </h2>
        <ul className="grid gap-4 sm:grid-cols-2">
          {QUESTIONS.map((q) => (
            <li key={q.title} className="rounded-lg border border-paper-line bg-white/80 p-4">
              <h3 className="font-semibold text-ink">{q.title}</h3>
              <p className="mt-1 text-sm text-ink-soft">{q.text}</p>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="landing-steps" className="space-y-4">
        <h2 id="landing-steps" className="text-2xl font-semibold text-ink">
          How it goes
        </h2>
        <ol className="list-decimal space-y-2 pl-6 text-ink">
          {STEPS.map((s) => (
            <li key={s}>{s}</li>
          ))}
        </ol>
        <p className="text-sm text-ink-soft">
          Studies can be compared side by side, printed as a report, exported as CSV and shared with a read-only link. Maps come from the team’s library; a
          picture of a map can be traced into a map file in the browser.
        </p>
      </section>

      <section aria-label="Caution" className="rounded-md border-l-4 border-copper bg-copper/10 p-4 text-sm text-ink">
        <strong>Caution.</strong> Results are estimates from a model. Turbochargers can overspeed and burst, surge damages bearings, and lean mixtures and
        exhaust heat destroy engines: confirm every choice against the manufacturers’ published limits, testing on the dyno and qualified people.
      </section>

      <p className="text-sm text-ink-soft">
        Already have an account? <Link to={paths.signIn.href()}>Sign in</Link>.
      </p>
    </div>
  );
}
