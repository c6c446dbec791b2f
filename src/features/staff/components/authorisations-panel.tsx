import { useState } from 'react';
import type { StaffMember } from '@shared/schemas/staff';
import { grantAuthorisationSchema } from '@shared/schemas/staff';
import { ataChapters, licenceCategories, type LicenceCategory } from '@shared/domain/authorisation';
import { calendarDay } from '@/lib/when';
import { recordTime } from '@/lib/when';
import { useAuthorisations, useGrantAuthorisation, useRevokeAuthorisation } from '../api/authorisations';
import { useTypes } from '@/lib/shared-queries';
import { Loading, Panel, ServerError, tableClass } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { Button } from '@/components/ui/button';

const chapterKeys = Object.keys(ataChapters).filter((k) => k !== 'all');

/**
 * A person's certifying authorisations (EASA Part-145 145.A.30 and 145.A.35, from memory): category, types, the
 * ATA chapters covered and the expiry date, in words; engineering grants and withdraws them, each change audited.
 */
export function AuthorisationsPanel({ person, onClose }: { person: StaffMember; onClose: () => void }) {
  const list = useAuthorisations(person.id);
  const grant = useGrantAuthorisation(person.id);
  const revoke = useRevokeAuthorisation(person.id);
  const types = useTypes();
  const [category, setCategory] = useState<LicenceCategory>('B1');
  const [typeCodes, setTypeCodes] = useState<string[]>([]);
  const [all, setAll] = useState(true);
  const [chapters, setChapters] = useState<string[]>([]);
  const [expiresOn, setExpiresOn] = useState('');
  const [reference, setReference] = useState('');
  const [problem, setProblem] = useState<{ path: string; message: string } | null>(null);
  const [confirm, setConfirm] = useState<number | null>(null);
  const toggle = (list: string[], value: string, on: boolean) =>
    on ? [...list, value] : list.filter((v) => v !== value);

  return (
    <Panel
      title={`Certifying authorisations of ${person.name}`}
      actions={
        <Button tone="quiet" onClick={onClose}>
          Close
        </Button>
      }
    >
      <div data-testid="authorisations">
        {list.isPending ? (
          <Loading what="authorisations" />
        ) : list.isError ? (
          <ServerError error={list.error} />
        ) : list.data.length === 0 ? (
          <p className="text-ink-muted">
            None recorded: {person.name.split(' ')[0]} cannot certify a release or defer a defect.
          </p>
        ) : (
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Authorisation</th>
                <th>Reference</th>
                <th>Granted</th>
                <th>State</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {list.data.map((a) => {
                const expired = a.expiresOn < new Date().toISOString().slice(0, 10);
                return (
                  <tr key={a.id} className={a.revokedAt || expired ? 'text-ink-muted' : ''}>
                    <td className="font-semibold">{a.words}</td>
                    <td>{a.reference}</td>
                    <td>
                      by {a.grantedBy}, {recordTime(a.grantedAt)}
                    </td>
                    <td>
                      {a.revokedAt
                        ? `✕ withdrawn ${recordTime(a.revokedAt)}`
                        : expired
                          ? `✕ expired ${calendarDay(a.expiresOn)}`
                          : `● valid until ${calendarDay(a.expiresOn)}`}
                    </td>
                    <td className="flex justify-end gap-2">
                      {!a.revokedAt &&
                        (confirm === a.id ? (
                          <>
                            <Button
                              className="h-8"
                              tone="stop"
                              onClick={() => revoke.mutate(a.id, { onSettled: () => setConfirm(null) })}
                            >
                              Yes, withdraw
                            </Button>
                            <Button className="h-8" tone="quiet" onClick={() => setConfirm(null)}>
                              No
                            </Button>
                          </>
                        ) : (
                          <Button className="h-8" onClick={() => setConfirm(a.id)}>
                            Withdraw
                          </Button>
                        ))}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </div>
      <ServerError error={revoke.error} title="Not withdrawn" />

      <form
        noValidate
        className="flex flex-col gap-3 border-t-2 border-ink-line pt-3"
        aria-label="Grant an authorisation"
        onSubmit={(event) => {
          event.preventDefault();
          const parsed = grantAuthorisationSchema.safeParse({
            category,
            typeCodes,
            scope: all ? ['all'] : chapters,
            expiresOn,
            reference,
          });
          if (!parsed.success) {
            const issue = parsed.error.issues[0];
            setProblem({ path: String(issue?.path[0] ?? ''), message: issue?.message ?? 'Check the form.' });
            return;
          }
          setProblem(null);
          grant.mutate(parsed.data, {
            onSuccess: () => {
              setTypeCodes([]);
              setChapters([]);
              setAll(true);
              setExpiresOn('');
              setReference('');
            },
          });
        }}
      >
        <h3 className="text-[19px] font-bold">Grant an authorisation</h3>
        <div className="grid grid-cols-[120px_1fr_170px_200px] gap-3">
          <Field label="Category" error={problem?.path === 'category' ? problem.message : undefined}>
            <Select value={category} onChange={(e) => setCategory(e.target.value as LicenceCategory)}>
              <Options items={licenceCategories} value={(c) => c} label={(c) => c} />
            </Select>
          </Field>
          <Field label="Types" error={problem?.path === 'typeCodes' ? problem.message : undefined}>
            <div className="flex h-10 flex-wrap items-center gap-4">
              {types.data?.map((t) => (
                <label key={t.id} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    className="size-5"
                    checked={typeCodes.includes(t.code)}
                    onChange={(e) => setTypeCodes(toggle(typeCodes, t.code, e.target.checked))}
                  />
                  {t.code}
                </label>
              ))}
            </div>
          </Field>
          <Field
            label="Valid until (last day)"
            error={problem?.path === 'expiresOn' ? problem.message : undefined}
          >
            <Input type="date" value={expiresOn} onChange={(e) => setExpiresOn(e.target.value)} />
          </Field>
          <Field
            label="Authorisation number"
            error={problem?.path === 'reference' ? problem.message : undefined}
          >
            <Input
              value={reference}
              onChange={(e) => setReference(e.target.value)}
              placeholder="e.g. TIA-145-017"
            />
          </Field>
        </div>
        <Field label="Scope" error={problem?.path === 'scope' ? problem.message : undefined}>
          <div className="flex flex-wrap items-center gap-x-5 gap-y-2">
            <label className="flex items-center gap-1 font-semibold">
              <input
                type="checkbox"
                className="size-5"
                checked={all}
                onChange={(e) => setAll(e.target.checked)}
              />
              {ataChapters.all}
            </label>
            {!all &&
              chapterKeys.map((key) => (
                <label key={key} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    className="size-5"
                    checked={chapters.includes(key)}
                    onChange={(e) => setChapters(toggle(chapters, key, e.target.checked))}
                  />
                  {ataChapters[key as keyof typeof ataChapters]}
                </label>
              ))}
          </div>
        </Field>
        <div>
          <Button type="submit" tone="primary" disabled={grant.isPending}>
            Grant authorisation
          </Button>
        </div>
        <ServerError error={grant.error} title="Not granted" />
      </form>
    </Panel>
  );
}
