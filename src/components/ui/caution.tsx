import { TriangleAlert } from 'lucide-react';
import { publicCaution } from '../../../shared/workflow/caution';


/** Carried by every public page (and every e-mail, server side). */
export function Caution() {
  return (
    <aside
      aria-label="Caution"
      className="flex gap-2.5 rounded-md border border-warning-line border-l-4 bg-warning-soft px-3.5 py-2.5 text-sm text-ink"
    >
      <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0 text-warning" />
      <p>{publicCaution}</p>
    </aside>
  );
}
