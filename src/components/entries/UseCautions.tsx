/** The usual cautions for what a grower is about to do with a harvest (preserving, selling). */
import type { Use } from '@/lib/entry-schemas';

export function UseCautions({ uses }: { uses: readonly Use[] }) {
  const preserved = uses.includes('preserved');
  const sold = uses.includes('sold');
  if (!preserved && !sold) return null;
  return (
    <div className="caution mt-4 space-y-1" data-testid="use-caution">
      {preserved && (
        <p>
          Preserving: follow tested, published guidance for your method. Home canning of low-acid food (beans, corn,
          potatoes, squash, most vegetables, meat) needs a pressure canner; a water bath is not enough.
        </p>
      )}
      {sold && <p>Selling produce, eggs or honey may need a licence or labelling where you live: check your local rules.</p>}
    </div>
  );
}
