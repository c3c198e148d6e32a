import type { Enrolled, EnrolledRow } from './api';
import { plural } from './api';

function MailState({ row }: { row: EnrolledRow }) {
  return row.mail === 'sent' ? (
    <span className="text-go-700">✓ e-mail sent</span>
  ) : (
    <span className="font-semibold text-signal-700">⚠ e-mail not sent: the mail relay refused it; the record is saved</span>
  );
}

/** What an invitation or import did, person by person, with whether each e-mail went out. */
export function EnrolledSummary({ result, testId }: { result: Enrolled; testId: string }) {
  const failed = [...result.added, ...result.invited].filter((r) => r.mail === 'failed').length;
  return (
    <div role="status" className="mt-4 rounded-lg border border-go-500 bg-go-50 px-4 py-3 text-steel-900" data-testid={testId}>
      <p className="font-semibold text-go-700">
        ✓ Done: {plural(result.added.length, 'person joined', 'people joined')} the class, {plural(result.invited.length, 'invitation', 'invitations')}{' '}
        recorded.
        {failed > 0 && <span className="text-signal-700"> ⚠ {plural(failed, 'e-mail', 'e-mails')} could not be sent.</span>}
      </p>
      {result.added.length > 0 && (
        <>
          <p className="mt-2 font-semibold">Joined now (they had an account)</p>
          <ul className="list-disc pl-6">
            {result.added.map((r) => (
              <li key={r.email}>
                {r.name} · {r.email} · <MailState row={r} />
              </li>
            ))}
          </ul>
        </>
      )}
      {result.invited.length > 0 && (
        <>
          <p className="mt-2 font-semibold">Invited (a sign-up link that joins the class)</p>
          <ul className="list-disc pl-6">
            {result.invited.map((r) => (
              <li key={r.email}>
                {r.name ? `${r.name} · ` : ''}
                {r.email} · <MailState row={r} />
              </li>
            ))}
          </ul>
        </>
      )}
      <a href="" className="mt-2 inline-flex min-h-touch items-center font-semibold text-steel-800 underline">
        Show the updated class
      </a>
    </div>
  );
}
