/** A short illustrated explainer: how a charger can make radio noise, and what a ferrite clip does. Our own drawings. */
export function NoiseExplainer() {
  return (
    <section aria-labelledby="explainer-heading" className="card space-y-4">
      <h2 id="explainer-heading" className="text-xl font-bold">What is going on, in two pictures</h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <figure className="space-y-2">
          <svg viewBox="0 0 200 120" role="img" aria-labelledby="svg-charger-title" className="w-full rounded-md bg-hush-50">
            <title id="svg-charger-title">A plug-in charger on a wall socket, with wavy lines spreading from its cable</title>
            <rect x="18" y="30" width="36" height="56" rx="4" fill="#dfe7ee" stroke="#1c2a36" strokeWidth="2" />
            <circle cx="30" cy="52" r="3" fill="#1c2a36" />
            <circle cx="42" cy="52" r="3" fill="#1c2a36" />
            <rect x="58" y="40" width="34" height="36" rx="6" fill="#ffffff" stroke="#1c2a36" strokeWidth="2" />
            <path d="M54 52h4M54 64h4" stroke="#1c2a36" strokeWidth="3" />
            <path d="M92 58 C120 58 120 96 150 96 L182 96" fill="none" stroke="#1c2a36" strokeWidth="3" />
            <g fill="none" stroke="#c46a12" strokeWidth="2" strokeLinecap="round">
              <path d="M112 46 q6 -6 12 0 t12 0 t12 0" />
              <path d="M118 32 q6 -6 12 0 t12 0 t12 0 t12 0" />
              <path d="M124 18 q6 -6 12 0 t12 0 t12 0 t12 0 t12 0" />
            </g>
          </svg>
          <figcaption className="text-sm text-ink-soft">
            A charger switches current very fast. A little of it escapes along the cable as radio waves: harmless, but loud on a radio.
          </figcaption>
        </figure>
        <figure className="space-y-2">
          <svg viewBox="0 0 200 120" role="img" aria-labelledby="svg-ferrite-title" className="w-full rounded-md bg-hush-50">
            <title id="svg-ferrite-title">A cable with a snap-on ferrite clip; the wavy lines stop at the clip</title>
            <path d="M10 70 L190 70" stroke="#1c2a36" strokeWidth="3" />
            <rect x="84" y="54" width="40" height="32" rx="8" fill="#44505c" stroke="#1c2a36" strokeWidth="2" />
            <path d="M84 70h40" stroke="#8797a6" strokeWidth="2" strokeDasharray="4 3" />
            <g fill="none" stroke="#c46a12" strokeWidth="2" strokeLinecap="round">
              <path d="M136 50 q5 -5 10 0 t10 0" opacity="0.35" />
              <path d="M18 50 q6 -6 12 0 t12 0 t12 0 t12 0" />
              <path d="M24 36 q6 -6 12 0 t12 0 t12 0" />
            </g>
            <text x="104" y="104" textAnchor="middle" fontSize="12" fill="#1c2a36" fontFamily="sans-serif">ferrite clip</text>
          </svg>
          <figcaption className="text-sm text-ink-soft">
            A ferrite clip snapped onto the cable near the device soaks up much of that leak. It costs little and changes nothing else.
          </figcaption>
        </figure>
      </div>
      <p className="text-sm">
        Nobody needs to enter your home, and you decide what, if anything, to try. The club has no authority; where rules apply, the national
        regulator decides.
      </p>
    </section>
  );
}
