import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  recordExportLabels,
  recordExportNames,
  recordSearchSchema,
  type RecordSearch,
  type RecordSearchInput,
} from '@shared/schemas/records';
import { checkKindSchema, verdictSchema } from '@shared/schemas/limits';
import { auditActionLabel, checkKindLabels, plainName, verdictLabels } from '@shared/schemas/plain';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { Notice } from '@/components/ui/notice';
import {
  checkPdfHref,
  csvHref,
  useAirframeOptions,
  useAuditEvents,
  useFullRecord,
  useRecords,
  useTrends,
  useVerifyTrail,
} from '../api/records';
import { DeskPage, Loading, Panel, ServerError, tableClass } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { calendarDay, recordTime } from '@/lib/when';
import { describeEntry } from '@/lib/describe-entry';
import { describeContext, systemWords, typeWords } from '@shared/domain/words';
import { TrendChart } from './trend-chart';
import { Button } from '@/components/ui/button';

const filterKeys = ['airframeId', 'staffId', 'kind', 'verdict', 'from', 'to'] as const;
type Filters = Partial<Record<(typeof filterKeys)[number] | 'page', string>>;

export function RecordsPage() {
  const [params, setParams] = useSearchParams();
  const airframes = useAirframeOptions();
  const filters: Filters = Object.fromEntries(filterKeys.map((k) => [k, params.get(k) ?? '']));
  const page = Number(params.get('page') ?? '1') || 1;
  const search: RecordSearchInput = { ...filters, page, pageSize: 50 };
  const records = useRecords(search);
  const { register, handleSubmit, formState } = useForm<RecordSearchInput, unknown, RecordSearch>({
    resolver: zodResolver(recordSearchSchema),
    defaultValues: filters,
  });
  const apply = (next: Record<string, string | number | undefined>) => {
    const p = new URLSearchParams();
    for (const [k, v] of Object.entries(next))
      if (v !== undefined && v !== '' && v !== null) p.set(k, String(v));
    setParams(p);
  };
  return (
    <DeskPage title="Records" showsLimits>
      <Panel>
        <form
          noValidate
          className="grid grid-cols-[130px_130px_150px_150px_150px_150px_auto] items-start gap-3"
          onSubmit={(e) => void handleSubmit(({ page: _p, pageSize: _s, ...v }) => apply(v))(e)}
        >
          <Field label="Airframe">
            <Select {...register('airframeId')}>
              <Options none="all" items={airframes.data} value={(a) => a.id} label={(a) => a.fleetNumber} />
            </Select>
          </Field>
          <Field label="Person (staff id)">
            <Input {...register('staffId')} inputMode="numeric" />
          </Field>
          <Field label="Kind">
            <Select {...register('kind')}>
              <Options
                none="all"
                items={checkKindSchema.options}
                value={(k) => k}
                label={(k) => checkKindLabels[k]}
              />
            </Select>
          </Field>
          <Field label="Verdict">
            <Select {...register('verdict')}>
              <Options
                none="all"
                items={verdictSchema.options}
                value={(v) => v}
                label={(v) => verdictLabels[v]}
              />
            </Select>
          </Field>
          <Field label="From (UTC day)" error={formState.errors.from?.message}>
            <Input type="date" {...register('from')} />
          </Field>
          <Field label="To (UTC day)" error={formState.errors.to?.message}>
            <Input type="date" {...register('to')} />
          </Field>
          <div className="mt-6 flex gap-2">
            <Button type="submit" tone="primary">
              Search
            </Button>
          </div>
        </form>
        <nav aria-label="Export this search" className="mt-3 flex flex-wrap items-center gap-2">
          <span className="text-ink-muted">Export this search as CSV, one row per:</span>
          {recordExportNames.map((name) => (
            <a
              key={name}
              className="inline-flex h-10 items-center whitespace-nowrap rounded-lg border-2 border-ink-line px-3 font-semibold"
              href={csvHref(search, name)}
              download
            >
              {name === 'fluid' ? 'Fluid entry' : recordExportLabels[name].replace(/s$/, '')}
            </a>
          ))}
        </nav>
      </Panel>
      <ServerError error={records.error} title="Search failed" />
      {records.data && (
        <Panel title={`${records.data.total} checks`}>
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Signed (UTC)</th>
                <th>Airframe</th>
                <th>Registration</th>
                <th>Kind</th>
                <th>Verdict</th>
                <th>Signed by</th>
                <th>Licence</th>
                <th>Limits</th>
                <th className="text-right">Hours</th>
                <th>Signature hash</th>
              </tr>
            </thead>
            <tbody>
              {records.data.rows.map((r) => (
                <tr key={r.id}>
                  <td>
                    <Link className="underline" to={`/desk/records/${r.id}`}>
                      {recordTime(r.signedAt)}
                    </Link>
                  </td>
                  <td className="font-semibold">{r.fleetNumber}</td>
                  <td>{r.registration ?? '—'}</td>
                  <td>{checkKindLabels[r.kind]}</td>
                  <td>
                    <span className="inline-block origin-left scale-75">
                      <VerdictBadge verdict={r.verdict} />
                    </span>
                  </td>
                  <td>{r.signedBy}</td>
                  <td>{r.licenceNumber ?? '—'}</td>
                  <td>
                    {r.typeCode} v{r.limitsVersion}
                  </td>
                  <td className="text-right tabular">{r.airframeHours?.toFixed(1) ?? '—'}</td>
                  <td className="font-mono text-[14px]">{r.contentHash.slice(0, 12)}…</td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="flex items-center gap-3">
            <Button disabled={page <= 1} onClick={() => apply({ ...filters, page: String(page - 1) })}>
              Newer
            </Button>
            <span>
              Page {page} of {Math.max(1, Math.ceil(records.data.total / records.data.pageSize))}
            </span>
            <Button
              disabled={page * records.data.pageSize >= records.data.total}
              onClick={() => apply({ ...filters, page: String(page + 1) })}
            >
              Older
            </Button>
          </div>
        </Panel>
      )}
    </DeskPage>
  );
}

export function RecordPage() {
  const checkId = useParams().checkId ?? '';
  const record = useFullRecord(checkId);
  const [showSigned, setShowSigned] = useState(false);
  if (record.isPending) return <Loading what="record" />;
  if (record.isError) return <ServerError error={record.error} title="Record not loaded" />;
  const r = record.data;
  return (
    <DeskPage
      title={`${r.airframe.fleetNumber} · ${checkKindLabels[r.kind]} · ${recordTime(r.signedAt)}`}
      showsLimits
      actions={
        <span className="flex gap-4">
          <a href={checkPdfHref(r.id)} target="_blank" rel="noreferrer" className="underline">
            Printable record (PDF)
          </a>
          <Link to="/desk/records" className="underline">
            Back to records
          </Link>
        </span>
      }
    >
      {r.integrity.ok ? (
        <Notice tone="normal" title="Record matches its signature">
          The stored readings are what was signed (SHA-256 {r.contentHash}).
        </Notice>
      ) : (
        <Notice tone="warning" title="This record no longer matches its signature">
          {r.integrity.problem}
        </Notice>
      )}
      <Panel title="Check">
        <dl className="grid grid-cols-[220px_1fr_220px_1fr] gap-x-4 gap-y-1">
          <dt className="text-ink-muted">Aircraft</dt>
          <dd>
            {r.airframe.registration ? `${r.airframe.registration}, ` : ''}
            {r.airframe.fleetNumber} (serial {r.airframe.serial}), {typeWords(r.type)}
          </dd>
          <dt className="text-ink-muted">Total time in service</dt>
          <dd className="tabular">
            {r.airframeHours === null ? 'not recorded' : `${r.airframeHours.toFixed(1)} h`}
          </dd>
          <dt className="text-ink-muted">Judged against</dt>
          <dd>
            {r.type.code} limits v{r.limitsVersion.version} (published{' '}
            {recordTime(r.limitsVersion.publishedAt)})
          </dd>
          <dt className="text-ink-muted">Verdict</dt>
          <dd>
            <VerdictBadge verdict={r.verdict} />
          </dd>
          <dt className="text-ink-muted">Signed by</dt>
          <dd>
            {r.signedBy.name} (badge {r.signedBy.badgeNumber}
            {r.signedBy.active ? '' : ', since deactivated'})
          </dd>
          <dt className="text-ink-muted">Licence</dt>
          <dd>{r.signedBy.licenceNumber ?? 'none recorded'}</dd>
          <dt className="text-ink-muted">Signed at</dt>
          <dd>{recordTime(r.signedAt)}</dd>
          <dt className="text-ink-muted">Conditions</dt>
          <dd>{describeContext(r.context, '—')}</dd>
          <dt className="text-ink-muted">Signature hash</dt>
          <dd className="col-span-3 font-mono text-[14px] break-all">{r.contentHash}</dd>
          {r.auditEvent && (
            <>
              <dt className="text-ink-muted">Audit trail event</dt>
              <dd className="col-span-3 font-mono text-[14px] break-all">
                #{r.auditEvent.id} {r.auditEvent.hash}
              </dd>
            </>
          )}
          {r.note && (
            <>
              <dt className="text-ink-muted">Note</dt>
              <dd className="col-span-3">{r.note}</dd>
            </>
          )}
          {r.correctsCheckId && (
            <>
              <dt className="text-ink-muted">Corrects</dt>
              <dd className="col-span-3">
                <Link className="underline" to={`/desk/records/${r.correctsCheckId}`}>
                  {r.correctsCheckId}
                </Link>
              </dd>
            </>
          )}
          {r.correctedBy.length > 0 && (
            <>
              <dt className="text-ink-muted">Corrected by</dt>
              <dd className="col-span-3">
                {r.correctedBy.map((c) => (
                  <Link key={c.id} className="mr-3 underline" to={`/desk/records/${c.id}`}>
                    {recordTime(c.signedAt)}
                  </Link>
                ))}
              </dd>
            </>
          )}
        </dl>
      </Panel>
      <Panel title="Readings">
        <table className={tableClass}>
          <thead>
            <tr>
              <th>#</th>
              <th>Checkpoint</th>
              <th>ATA</th>
              <th>Approved data</th>
              <th>Entered</th>
              <th>Verdict</th>
              <th>Band · message</th>
              <th>Tool</th>
              <th>Photos</th>
            </tr>
          </thead>
          <tbody>
            {r.readings.map((x) => (
              <tr key={x.seq}>
                <td className="tabular">{x.seq + 1}</td>
                <td>{x.label}</td>
                <td>{x.ata ?? '—'}</td>
                <td className="text-[15px]">{x.reference ?? '—'}</td>
                <td className="tabular">
                  {describeEntry(x.entry)}
                  {x.expected !== null && (
                    <span className="text-ink-muted"> (expected {x.expected.toFixed(1)})</span>
                  )}
                </td>
                <td>
                  <span className="inline-block origin-left scale-75">
                    <VerdictBadge verdict={x.verdict} />
                  </span>
                </td>
                <td className="text-[15px]">{x.message}</td>
                <td className="text-[15px]">
                  {x.tool ? (
                    <>
                      {x.tool.number}, {x.tool.description} (calibration due{' '}
                      {calendarDay(x.tool.calibrationDue)})
                    </>
                  ) : (
                    '—'
                  )}
                </td>
                <td className="text-[14px]">
                  {x.photos.map((p) => (
                    <a key={p.id} className="mr-2 underline" href={`/api/photos/${p.id}`}>
                      photo {p.sha256.slice(0, 8)}
                    </a>
                  ))}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Panel>
      {r.servicing.length > 0 && (
        <Panel title="Fluid added">
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Checkpoint</th>
                <th>System</th>
                <th>Entered</th>
                <th>Litres</th>
                <th>Fluid</th>
                <th>Batch</th>
                <th>Can opened</th>
                <th>Cart</th>
                <th>Level before</th>
              </tr>
            </thead>
            <tbody>
              {r.servicing.map((s, i) => (
                <tr key={i}>
                  <td>{r.readings.find((x) => x.code === s.code)?.label ?? 'Level'}</td>
                  <td>{systemWords(s.system)}</td>
                  <td className="tabular">
                    {s.entered.value} {s.entered.unit}
                  </td>
                  <td className="tabular">{s.quantityL.toFixed(3)}</td>
                  <td>{s.fluidSpec}</td>
                  <td>{s.batch}</td>
                  <td>{s.canOpenedOn ? calendarDay(s.canOpenedOn) : 'not recorded'}</td>
                  <td>
                    {s.tool
                      ? `${s.tool.number} (calibration due ${calendarDay(s.tool.calibrationDue)})`
                      : 'none'}
                  </td>
                  <td>{describeEntry(s.levelBefore)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
      )}
      {r.hold && (
        <Panel title="Hold and countersignature">
          <p>
            Hold opened {recordTime(r.hold.openedAt)}: {r.hold.reason}.{' '}
            {r.hold.releasedAt ? `Released ${recordTime(r.hold.releasedAt)}.` : 'Still open.'}
          </p>
          {r.countersigns.length === 0 ? (
            <p className="text-ink-muted">No countersignature yet.</p>
          ) : (
            <ul>
              {r.countersigns.map((c, i) => (
                <li key={i}>
                  {c.decision} by {c.signedBy} (licence {c.licenceNumber ?? '—'}) at {recordTime(c.signedAt)}
                  {c.reason ? `: ${c.reason}` : ''} ·{' '}
                  <span className="font-mono text-[14px]">{c.contentHash.slice(0, 16)}…</span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      )}
      <Panel
        title="Exactly what was signed"
        actions={<Button onClick={() => setShowSigned(!showSigned)}>{showSigned ? 'Hide' : 'Show'}</Button>}
      >
        {showSigned && (
          <pre className="max-h-[400px] overflow-auto rounded bg-ink p-2 text-[14px]">
            {JSON.stringify(r.signedContent, null, 2)}
          </pre>
        )}
      </Panel>
    </DeskPage>
  );
}

export function TrendsPage() {
  const airframes = useAirframeOptions();
  const [params, setParams] = useSearchParams();
  const airframeId = params.get('airframeId') ? Number(params.get('airframeId')) : null;
  const days = Number(params.get('days') ?? '90') || 90;
  const trends = useTrends(airframeId, days);
  const set = (k: string, v: string) => {
    const p = new URLSearchParams(params);
    if (v) p.set(k, v);
    else p.delete(k);
    setParams(p);
  };
  return (
    <DeskPage title="Fluid trends" showsLimits>
      <Panel>
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Airframe">
            <Select value={airframeId ?? ''} onChange={(e) => set('airframeId', e.target.value)}>
              <Options
                none="choose…"
                items={airframes.data}
                value={(a) => a.id}
                label={(a) => a.fleetNumber}
              />
            </Select>
          </Field>
          <Field label="Window">
            <Select value={days} onChange={(e) => set('days', e.target.value)}>
              {[7, 30, 90, 365].map((d) => (
                <option key={d} value={d}>
                  last {d} days
                </option>
              ))}
            </Select>
          </Field>
          {trends.data && (
            <p className="text-ink-muted">
              Alert level for {trends.data.airframe.typeCode}: {trends.data.thresholdLPerFh} L per flight
              hour.
            </p>
          )}
        </div>
      </Panel>
      <ServerError error={trends.error} title="Trends not loaded" />
      {trends.data?.systems.map((s) => (
        <Panel key={s.system} title={s.label}>
          <p>
            {s.window.litresAdded.toFixed(2)} L added over {s.window.flightHours.toFixed(1)} flight hours in{' '}
            {s.window.days} days
            {s.window.litresPerFlightHour !== null
              ? `: ${s.window.litresPerFlightHour.toFixed(3)} L per flight hour.`
              : '.'}
          </p>
          {s.levels.length === 0 && s.ratePerFh.length === 0 ? (
            <p className="text-ink-muted">No level readings in this window.</p>
          ) : (
            <TrendChart system={s} threshold={trends.data.thresholdLPerFh} days={trends.data.days} />
          )}
          {s.alerts.length === 0 ? (
            <p>● No consumption alerts.</p>
          ) : (
            s.alerts.map((a, i) => (
              <Notice
                key={i}
                tone="warning"
                title={
                  a.kind === 'rate_at_or_above_threshold'
                    ? 'Consumption at or above the alert level'
                    : a.kind.replaceAll('_', ' ')
                }
              >
                {a.message}{' '}
                <span className="text-[17px]">
                  Checks behind it:{' '}
                  {a.checkIds.map((id) => (
                    <Link key={id} className="mr-2 underline" to={`/desk/records/${id}`}>
                      {id.slice(0, 8)}
                    </Link>
                  ))}
                </span>
              </Notice>
            ))
          )}
        </Panel>
      ))}
    </DeskPage>
  );
}

export function AuditPage() {
  const verify = useVerifyTrail();
  const events = useAuditEvents();
  return (
    <DeskPage title="Audit trail">
      <Panel>
        <div className="flex items-center gap-3">
          <Button tone="primary" disabled={verify.isPending} onClick={() => verify.mutate()}>
            {verify.isPending ? 'Verifying…' : 'Verify the trail'}
          </Button>
          <span className="text-ink-muted">
            Walks every event's hash chain and checks each signed check against what was signed.
          </span>
        </div>
        <ServerError error={verify.error} title="Not verified" />
        {verify.data &&
          (verify.data.ok ? (
            <Notice tone="normal" title="The trail verifies">
              {verify.data.events} events, every link and every signed check intact (
              {recordTime(verify.data.checkedAt)}).
            </Notice>
          ) : (
            <Notice tone="warning" title="The trail is broken">
              First broken link: event number {verify.data.firstBroken?.id} (
              {auditActionLabel(verify.data.firstBroken?.action ?? '')}
              {verify.data.firstBroken?.entity === 'check' ? (
                <>
                  {', '}
                  <Link className="underline" to={`/desk/records/${verify.data.firstBroken.entityId}`}>
                    the check record
                  </Link>
                </>
              ) : null}
              ): {verify.data.firstBroken?.reason}.
            </Notice>
          ))}
      </Panel>
      <Panel title="Latest events">
        {events.isPending ? (
          <Loading what="events" />
        ) : events.isError ? (
          <ServerError error={events.error} />
        ) : (
          <table className={tableClass}>
            <thead>
              <tr>
                <th>#</th>
                <th>At</th>
                <th>Who</th>
                <th>What</th>
                <th>On</th>
                <th>Hash</th>
              </tr>
            </thead>
            <tbody>
              {events.data.map((e) => (
                <tr key={e.id}>
                  <td className="tabular">{e.id}</td>
                  <td>{recordTime(e.at)}</td>
                  <td>{e.actor ?? 'system'}</td>
                  <td>{auditActionLabel(e.action)}</td>
                  <td>
                    {e.entity === 'check' ? (
                      <Link className="underline" to={`/desk/records/${e.entityId}`}>
                        the check record
                      </Link>
                    ) : (
                      plainName(e.entity).toLowerCase()
                    )}
                  </td>
                  <td className="font-mono text-[14px]">{e.hash.slice(0, 12)}…</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
    </DeskPage>
  );
}
