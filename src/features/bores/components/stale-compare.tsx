import { Alert } from '@/components/ui/alert';
import { CompareTable } from '@/components/ui/compare-table';
import { Button } from '@/components/ui/button';

export interface CompareRow {
  label: string;
  mine: string;
  theirs: string;
}

/**
 * After a 409 stale version: each field where what the designer typed differs from the record
 * someone else saved, side by side. Saving again overwrites theirs (the form now carries their
 * version number); "Take the saved one" puts the saved record in the form instead.
 */
export function StaleCompare({ what, rows, onTakeTheirs }: { what: string; rows: CompareRow[]; onTakeTheirs: () => void }) {
  return (
    <section aria-label="Your version and the saved version" className="space-y-3 rounded-lg border-2 border-caution-300 bg-caution-50 p-4">
      <Alert tone="caution" title={`Not saved: someone else saved this ${what} after you opened it`}>
        <p>Nothing of yours is saved yet. Compare the two versions; save again to keep yours over theirs, or take the saved one.</p>
      </Alert>
      {rows.length > 0 ? (
        <CompareTable>
          {rows.map((r) => (
            <tr key={r.label} className="border-t border-caution-300/60 align-top">
              <th scope="row" className="py-1 pr-2 text-left font-medium">
                {r.label}
              </th>
              <td className="py-1 pr-2 break-words">{r.mine}</td>
              <td className="py-1 break-words">{r.theirs}</td>
            </tr>
          ))}
        </CompareTable>
      ) : (
        <p className="text-sm">The saved version has the same values as yours in this form.</p>
      )}
      <Button variant="secondary" onClick={onTakeTheirs}>
        Take the saved {what}
      </Button>
    </section>
  );
}

/** Compare rows for the fields whose text differs. */
export function differingRows(fields: { label: string; mine: string; theirs: string }[]): CompareRow[] {
  return fields.filter((f) => f.mine.trim() !== f.theirs.trim());
}
