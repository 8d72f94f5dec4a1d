/** The cautions every hunter and committee member should keep in mind; shown on several pages. */
export const CAUTIONS = [
  { title: 'Hunt from public ground only', text: 'Take bearings from pavements, parks and lanes. Never enter private property, gardens or driveways without the owner’s invitation.' },
  { title: 'Never touch or climb utility hardware', text: 'Arcing insulators and faulty hardware on poles and lines are the utility’s job. Note the pole number from the ground and report it to the utility.' },
  { title: 'Never confront anyone', text: 'The owner almost never knows their device makes noise. Leave contact to the committee’s polite notice; walk away from any argument.' },
  { title: 'Local law and the regulator decide', text: 'Your licensing regulator and local law decide what counts as harmful interference and what must be done. The club has no authority; it offers help.' },
  { title: 'Keep people’s privacy', text: 'A reporter’s home position and name stay with the committee unless they agreed to share them. Do not photograph people or the inside of homes.' },
] as const;

export function CautionList({ compact = false }: { compact?: boolean }) {
  return (
    <ul className={compact ? 'space-y-2' : 'grid gap-4 sm:grid-cols-2'}>
      {CAUTIONS.map((c) => (
        <li key={c.title} className="card border-l-4 border-l-flare-500">
          <p className="font-bold text-ink">{c.title}</p>
          {!compact && <p className="mt-1 text-ink-soft">{c.text}</p>}
        </li>
      ))}
    </ul>
  );
}
