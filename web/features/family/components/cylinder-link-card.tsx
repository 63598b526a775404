import { Link } from 'react-router-dom';
import { FoldedSection } from '../../../components/ui/folded-section';

export function CylinderLinkCard({ href }: { href: string }) {
  return (
    <FoldedSection title="How long will a cylinder last?" large summary="Read the gauge and work it out.">
      <p className="mb-3 text-xl leading-relaxed text-ink-700">Read the gauge on the cylinder and see how long it lasts at your baby’s flow.</p>
      <Link
        to={href}
        className="inline-flex min-h-13 items-center justify-center rounded-xl border-2 border-brand-600 bg-surface-0 px-5 text-xl font-semibold text-brand-800 hover:bg-brand-50"
      >
        Work out cylinder time
      </Link>
    </FoldedSection>
  );
}
