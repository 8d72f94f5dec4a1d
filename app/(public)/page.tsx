import Link from 'next/link';

const STEPS = [
  { n: '1', title: 'Report', text: 'A member describes the noise: what it sounds like, which bands, how strong, when it is there.' },
  { n: '2', title: 'Hunt', text: 'A volunteer takes loop-null bearings from public spots. Each line narrows the search.' },
  { n: '3', title: 'Locate', text: 'Quietfix intersects the lines on the ellipsoid and draws a 95 % error ellipse, and says where to stand next.' },
  { n: '4', title: 'Notify', text: 'The committee sends one calm, helpful notice to the household — never five angry ones.' },
  { n: '5', title: 'Resolve', text: 'The neighbour answers through a private link; the case closes with an outcome and before/after levels.' },
];

export default function Landing() {
  return (
    <div className="space-y-10">
      <section className="space-y-4">
        <h1 className="text-3xl font-extrabold leading-tight sm:text-5xl">
          Find the noisy gadget.
          <br />
          <span className="text-hush-700">Fix it with a friendly letter.</span>
        </h1>
        <p className="max-w-2xl text-lg text-ink-soft">
          Switching power supplies, LED drivers, solar inverters and chargers can wipe out shortwave reception for a whole street.
          Quietfix helps radio clubs&apos; interference committees take a member&apos;s noise report through a direction-finding hunt with a
          small receiving loop, to a located source, a polite notice to the neighbour, and a recorded outcome.
        </p>
        <div className="flex flex-wrap gap-3">
          <Link href="/sign-in" className="btn-primary">
            Sign in to your club
          </Link>
          <Link href="/cautions" className="btn-quiet">
            Read the cautions first
          </Link>
        </div>
      </section>
      <section aria-labelledby="how">
        <h2 id="how" className="mb-4 text-2xl font-bold">
          How a case travels
        </h2>
        <ol className="grid gap-4 sm:grid-cols-5">
          {STEPS.map((s) => (
            <li key={s.n} className="card">
              <span className="flex h-9 w-9 items-center justify-center rounded-full bg-hush-700 font-bold text-white" aria-hidden="true">
                {s.n}
              </span>
              <p className="mt-2 font-bold">{s.title}</p>
              <p className="mt-1 text-sm text-ink-soft">{s.text}</p>
            </li>
          ))}
        </ol>
      </section>
      <section className="card bg-hush-50">
        <h2 className="text-xl font-bold">Got a letter from a radio club?</h2>
        <p className="mt-2 text-ink-soft">
          Use the private link in your letter to read it and answer. Nobody is accusing you of anything: many everyday devices leak radio
          noise without their owners knowing, and the club is glad to help for free.
        </p>
      </section>
    </div>
  );
}
