interface CautionsProps {
  variant: 'staff' | 'family';
  className?: string;
}

const STAFF_POINTS = [
  'These figures support a decision; they are not a prescription. A licensed clinician decides the setting.',
  'Follow your local protocols. Saturation targets and alarm limits come from the treating team.',
  'Oxygen fire safety at home: no smoking or open flames nearby, keep the equipment away from heat, no oil-based creams or balms on the face.',
  'In an emergency, call the local emergency number.',
];

const FAMILY_POINTS = [
  'Use only the setting your baby’s care team gave you. Do not change it yourself.',
  'Your care team sets the oxygen levels to aim for and when to worry. Ask them if you are unsure.',
  'These figures support your team’s decision: a consultant approved them, and your hospital’s own guidance comes first.',
  'Oxygen makes fire spread fast: no smoking and no candles or flames in the home, keep the oxygen away from heaters and cookers, and do not put oily creams or petroleum jelly on your baby’s face.',
  'In an emergency, call your local emergency number straight away.',
];

/** Shown wherever a setting is shown: the figures are support for a clinician, never an order on their own. */
export function Cautions({ variant, className = '' }: CautionsProps) {
  const family = variant === 'family';
  const points = family ? FAMILY_POINTS : STAFF_POINTS;
  return (
    <aside
      aria-label={family ? 'Keep your baby safe' : 'Cautions'}
      className={`rounded-xl border border-straw-300 bg-straw-50 p-3 text-straw-900 ${family ? 'text-lg leading-relaxed sm:p-5' : 'text-sm'} ${className}`}
    >
      <h2 className={`font-bold ${family ? 'mb-2 text-xl' : 'mb-1 text-base'}`}>
        {family ? 'Keep your baby safe' : 'Cautions'}
      </h2>
      <ul className={`list-disc pl-5 ${family ? 'flex flex-col gap-2' : 'flex flex-col gap-0.5'}`}>
        {points.map((point) => (
          <li key={point}>{point}</li>
        ))}
      </ul>
    </aside>
  );
}
