import type { PlannedRow } from '../../lib/roster/plan';

function Outcome({ row }: { row: PlannedRow }) {
  if (row.errors.length) {
    return (
      <ul className="text-signal-700">
        {row.errors.map((e) => (
          <li key={e}>
            <span aria-hidden="true">⚠ </span>
            {e}
          </li>
        ))}
      </ul>
    );
  }
  return row.action === 'add' ? (
    <span className="text-go-700">✓ Joins the class now (has an account)</span>
  ) : (
    <span className="text-steel-800">✉ Gets an invitation to sign up</span>
  );
}

/** Every row of the file with what importing would do to it, or what is wrong with it. */
export function RosterPreview({ rows }: { rows: PlannedRow[] }) {
  return (
    <div className="mt-4 max-h-[28rem] overflow-auto rounded-lg border border-steel-200">
      <table className="w-full min-w-[36rem] text-left text-sm" data-testid="roster-preview">
        <caption className="sr-only">Rows of the roster file and what importing does with each</caption>
        <thead className="sticky top-0 bg-steel-50 text-steel-600">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">
              Row
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Name
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              E-mail
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              On import
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {rows.map((row) => (
            <tr key={row.row} className={row.errors.length ? 'bg-signal-50' : undefined} data-row={row.row}>
              <td className="px-3 py-2 tabular-nums">{row.row}</td>
              <td className="px-3 py-2">{row.name || <span className="text-steel-400">—</span>}</td>
              <td className="break-all px-3 py-2">{row.email || <span className="text-steel-400">—</span>}</td>
              <td className="px-3 py-2">
                <Outcome row={row} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
