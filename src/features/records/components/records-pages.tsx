import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  recordExportNames,
  recordSearchSchema,
  type RecordSearch,
  type RecordSearchInput,
} from '@shared/schemas/records';
import { checkKindSchema, verdictSchema } from '@shared/schemas/limits';
import { auditActionLabel, plainName } from '@shared/schemas/plain';
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
import { DeskPage, Loading, Panel, ServerError, DeskTable } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { calendarDay, recordTime } from '@/lib/when';
import { describeEntry } from '@/lib/describe-entry';
import { fieldError } from '@/lib/field-error';
import { describeContext, systemWords, typeWords } from '@shared/domain/words';
import { TrendChart } from './trend-chart';
import { Button } from '@/components/ui/button';
import { checkKindLabel, verdictLabel } from '@shared/schemas/plain';
import { phraseWords } from '@shared/i18n/phrase';

const filterKeys = ['airframeId', 'staffId', 'kind', 'verdict', 'from', 'to'] as const;
type Filters = Partial<Record<(typeof filterKeys)[number] | 'page', string>>;

/** A figure with a fixed number of decimals in the reader's language ("4211.4", "4211,4"), never grouped. */
const fixed = (value: number, digits: number, language: string) =>
  new Intl.NumberFormat(language, {
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
    useGrouping: false,
  }).format(value);

export function RecordsPage() {
  const { t, i18n } = useTranslation('records');
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
    <DeskPage title={t('search.title')} showsLimits>
      <Panel>
        <form
          noValidate
          className="grid grid-cols-2 items-start gap-3 sm:grid-cols-3 xl:grid-cols-[130px_130px_150px_150px_150px_150px_auto]"
          onSubmit={(e) => void handleSubmit(({ page: _p, pageSize: _s, ...v }) => apply(v))(e)}
        >
          <Field label={t('search.airframe')}>
            <Select {...register('airframeId')}>
              <Options
                none={t('search.all')}
                items={airframes.data}
                value={(a) => a.id}
                label={(a) => a.fleetNumber}
              />
            </Select>
          </Field>
          <Field label={t('search.person')}>
            <Input {...register('staffId')} inputMode="numeric" />
          </Field>
          <Field label={t('search.kind')}>
            <Select {...register('kind')}>
              <Options
                none={t('search.all')}
                items={checkKindSchema.options}
                value={(k) => k}
                label={(k) => checkKindLabel(k)}
              />
            </Select>
          </Field>
          <Field label={t('search.verdict')}>
            <Select {...register('verdict')}>
              <Options
                none={t('search.all')}
                items={verdictSchema.options}
                value={(v) => v}
                label={(v) => verdictLabel(v)}
              />
            </Select>
          </Field>
          <Field label={t('search.from')} error={fieldError(formState.errors.from?.message)}>
            <Input type="date" {...register('from')} />
          </Field>
          <Field label={t('search.to')} error={fieldError(formState.errors.to?.message)}>
            <Input type="date" {...register('to')} />
          </Field>
          <div className="mt-6 flex gap-2">
            <Button type="submit" tone="primary">
              {t('search.submit')}
            </Button>
          </div>
        </form>
        <nav aria-label={t('search.exportLabel')} className="mt-3 flex flex-wrap items-center gap-2">
          <span className="text-ink-muted">{t('search.exportIntro')}</span>
          {recordExportNames.map((name) => (
            <a
              key={name}
              className="inline-flex h-10 items-center whitespace-nowrap rounded-lg border-2 border-ink-line px-3 font-semibold"
              href={csvHref(search, name)}
              download
            >
              {t(`exports.${name}`)}
            </a>
          ))}
        </nav>
      </Panel>
      <ServerError error={records.error} title={t('search.failed')} />
      {records.data && (
        <Panel title={t('list.checks', { count: records.data.total })}>
          <DeskTable>
            <thead>
              <tr>
                <th>{t('list.signedAt')}</th>
                <th>{t('list.airframe')}</th>
                <th>{t('list.registration')}</th>
                <th>{t('list.kind')}</th>
                <th>{t('list.verdict')}</th>
                <th>{t('list.signedBy')}</th>
                <th>{t('list.licence')}</th>
                <th>{t('list.limits')}</th>
                <th className="text-right">{t('list.hours')}</th>
                <th>{t('list.signatureHash')}</th>
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
                  <td>{checkKindLabel(r.kind)}</td>
                  <td>
                    <span className="inline-block origin-left scale-75">
                      <VerdictBadge verdict={r.verdict} />
                    </span>
                  </td>
                  <td>{r.signedBy}</td>
                  <td>{r.licenceNumber ?? '—'}</td>
                  <td>{t('list.limitsVersion', { typeCode: r.typeCode, version: r.limitsVersion })}</td>
                  <td className="text-right tabular">
                    {r.airframeHours === null ? '—' : fixed(r.airframeHours, 1, i18n.language)}
                  </td>
                  <td className="font-mono text-[14px]">{r.contentHash.slice(0, 12)}…</td>
                </tr>
              ))}
            </tbody>
          </DeskTable>
          <div className="flex items-center gap-3">
            <Button disabled={page <= 1} onClick={() => apply({ ...filters, page: String(page - 1) })}>
              {t('list.newer')}
            </Button>
            <span>
              {t('list.page', {
                page,
                pages: Math.max(1, Math.ceil(records.data.total / records.data.pageSize)),
              })}
            </span>
            <Button
              disabled={page * records.data.pageSize >= records.data.total}
              onClick={() => apply({ ...filters, page: String(page + 1) })}
            >
              {t('list.older')}
            </Button>
          </div>
        </Panel>
      )}
    </DeskPage>
  );
}

export function RecordPage() {
  const { t, i18n } = useTranslation('records');
  const checkId = useParams().checkId ?? '';
  const record = useFullRecord(checkId);
  const [showSigned, setShowSigned] = useState(false);
  if (record.isPending) return <Loading what={t('record.loadingWhat')} />;
  if (record.isError) return <ServerError error={record.error} title={t('record.notLoaded')} />;
  const r = record.data;
  return (
    <DeskPage
      title={`${r.airframe.fleetNumber} · ${checkKindLabel(r.kind)} · ${recordTime(r.signedAt)}`}
      showsLimits
      actions={
        <span className="flex gap-4">
          <a href={checkPdfHref(r.id)} target="_blank" rel="noreferrer" className="underline">
            {t('record.pdf')}
          </a>
          <Link to="/desk/records" className="underline">
            {t('record.back')}
          </Link>
        </span>
      }
    >
      {r.integrity.ok ? (
        <Notice tone="normal" title={t('record.matches')}>
          {t('record.matchesBody', { hash: r.contentHash })}
        </Notice>
      ) : (
        <Notice tone="warning" title={t('record.broken')}>
          {r.integrity.problem}
        </Notice>
      )}
      <Panel title={t('record.check')}>
        <dl className="grid grid-cols-[220px_1fr_220px_1fr] gap-x-4 gap-y-1">
          <dt className="text-ink-muted">{t('record.aircraft')}</dt>
          <dd>
            {r.airframe.registration ? `${r.airframe.registration}, ` : ''}
            {t('record.aircraftWords', {
              fleetNumber: r.airframe.fleetNumber,
              serial: r.airframe.serial,
              type: typeWords(r.type),
            })}
          </dd>
          <dt className="text-ink-muted">{t('record.timeInService')}</dt>
          <dd className="tabular">
            {r.airframeHours === null
              ? t('record.notRecorded')
              : t('record.hours', { hours: fixed(r.airframeHours, 1, i18n.language) })}
          </dd>
          <dt className="text-ink-muted">{t('record.judgedAgainst')}</dt>
          <dd>
            {t('record.judgedAgainstWords', {
              typeCode: r.type.code,
              version: r.limitsVersion.version,
              published: recordTime(r.limitsVersion.publishedAt),
            })}
          </dd>
          <dt className="text-ink-muted">{t('record.verdict')}</dt>
          <dd>
            <VerdictBadge verdict={r.verdict} />
          </dd>
          <dt className="text-ink-muted">{t('record.signedBy')}</dt>
          <dd>
            {r.signedBy.active
              ? t('record.signedByWords', { name: r.signedBy.name, badge: r.signedBy.badgeNumber })
              : t('record.signedByDeactivated', { name: r.signedBy.name, badge: r.signedBy.badgeNumber })}
          </dd>
          <dt className="text-ink-muted">{t('record.licence')}</dt>
          <dd>{r.signedBy.licenceNumber ?? t('record.noneRecorded')}</dd>
          <dt className="text-ink-muted">{t('record.signedAt')}</dt>
          <dd>{recordTime(r.signedAt)}</dd>
          <dt className="text-ink-muted">{t('record.conditions')}</dt>
          <dd>{describeContext(r.context, '—')}</dd>
          <dt className="text-ink-muted">{t('record.signatureHash')}</dt>
          <dd className="col-span-3 font-mono text-[14px] break-all">{r.contentHash}</dd>
          {r.auditEvent && (
            <>
              <dt className="text-ink-muted">{t('record.auditEvent')}</dt>
              <dd className="col-span-3 font-mono text-[14px] break-all">
                #{r.auditEvent.id} {r.auditEvent.hash}
              </dd>
            </>
          )}
          {r.note && (
            <>
              <dt className="text-ink-muted">{t('record.note')}</dt>
              <dd className="col-span-3">{r.note}</dd>
            </>
          )}
          {r.correctsCheckId && (
            <>
              <dt className="text-ink-muted">{t('record.corrects')}</dt>
              <dd className="col-span-3">
                <Link className="underline" to={`/desk/records/${r.correctsCheckId}`}>
                  {r.correctsCheckId}
                </Link>
              </dd>
            </>
          )}
          {r.correctedBy.length > 0 && (
            <>
              <dt className="text-ink-muted">{t('record.correctedBy')}</dt>
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
      <Panel title={t('readings.title')}>
        <DeskTable>
          <thead>
            <tr>
              <th>#</th>
              <th>{t('readings.checkpoint')}</th>
              <th>{t('readings.ata')}</th>
              <th>{t('readings.approvedData')}</th>
              <th>{t('readings.entered')}</th>
              <th>{t('readings.verdict')}</th>
              <th>{t('readings.bandMessage')}</th>
              <th>{t('readings.tool')}</th>
              <th>{t('readings.photos')}</th>
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
                    <span className="text-ink-muted">
                      {t('readings.expected', { value: fixed(x.expected, 1, i18n.language) })}
                    </span>
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
                      {t('readings.toolWords', {
                        number: x.tool.number,
                        description: x.tool.description,
                        due: calendarDay(x.tool.calibrationDue),
                      })}
                    </>
                  ) : (
                    '—'
                  )}
                </td>
                <td className="text-[14px]">
                  {x.photos.map((p) => (
                    <a key={p.id} className="mr-2 underline" href={`/api/photos/${p.id}`}>
                      {t('readings.photo', { hash: p.sha256.slice(0, 8) })}
                    </a>
                  ))}
                </td>
              </tr>
            ))}
          </tbody>
        </DeskTable>
      </Panel>
      {r.servicing.length > 0 && (
        <Panel title={t('fluid.title')}>
          <DeskTable>
            <thead>
              <tr>
                <th>{t('fluid.checkpoint')}</th>
                <th>{t('fluid.system')}</th>
                <th>{t('fluid.entered')}</th>
                <th>{t('fluid.litres')}</th>
                <th>{t('fluid.fluid')}</th>
                <th>{t('fluid.batch')}</th>
                <th>{t('fluid.canOpened')}</th>
                <th>{t('fluid.cart')}</th>
                <th>{t('fluid.levelBefore')}</th>
              </tr>
            </thead>
            <tbody>
              {r.servicing.map((s, i) => (
                <tr key={i}>
                  <td>{r.readings.find((x) => x.code === s.code)?.label ?? t('fluid.level')}</td>
                  <td>{systemWords(s.system)}</td>
                  <td className="tabular">
                    {s.entered.value} {s.entered.unit}
                  </td>
                  <td className="tabular">{fixed(s.quantityL, 3, i18n.language)}</td>
                  <td>{s.fluidSpec}</td>
                  <td>{s.batch}</td>
                  <td>{s.canOpenedOn ? calendarDay(s.canOpenedOn) : t('fluid.notRecorded')}</td>
                  <td>
                    {s.tool
                      ? t('fluid.cartWords', {
                          number: s.tool.number,
                          due: calendarDay(s.tool.calibrationDue),
                        })
                      : t('fluid.none')}
                  </td>
                  <td>{describeEntry(s.levelBefore)}</td>
                </tr>
              ))}
            </tbody>
          </DeskTable>
        </Panel>
      )}
      {r.hold && (
        <Panel title={t('hold.title')}>
          <p>
            {t('hold.opened', { time: recordTime(r.hold.openedAt), reason: r.hold.reason })}{' '}
            {r.hold.releasedAt
              ? t('hold.released', { time: recordTime(r.hold.releasedAt) })
              : t('hold.stillOpen')}
          </p>
          {r.countersigns.length === 0 ? (
            <p className="text-ink-muted">{t('hold.noCountersign')}</p>
          ) : (
            <ul>
              {r.countersigns.map((c, i) => (
                <li key={i}>
                  {t('hold.countersign', {
                    decision: c.decision,
                    by: c.signedBy,
                    licence: c.licenceNumber ?? '—',
                    time: recordTime(c.signedAt),
                  })}
                  {c.reason ? `: ${c.reason}` : ''} ·{' '}
                  <span className="font-mono text-[14px]">{c.contentHash.slice(0, 16)}…</span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      )}
      <Panel
        title={t('record.signedContent')}
        actions={
          <Button onClick={() => setShowSigned(!showSigned)}>
            {showSigned ? t('record.hide') : t('record.show')}
          </Button>
        }
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

/** Each kind of fluid alert's title, in words (the kind itself is a code). */
const alertTitles = {
  rate_at_or_above_threshold: 'trends.atOrAbove',
  fluid_without_flying: 'trends.withoutFlying',
  unexplained_level_drop: 'trends.levelDrop',
} as const;

export function TrendsPage() {
  const { t, i18n } = useTranslation('records');
  const airframes = useAirframeOptions();
  const [params, setParams] = useSearchParams();
  const airframeId = params.get('airframeId') ? Number(params.get('airframeId')) : null;
  const days = Number(params.get('days') ?? '90') || 90;
  const trends = useTrends(airframeId, days);
  const setParam = (k: string, v: string) => {
    const p = new URLSearchParams(params);
    if (v) p.set(k, v);
    else p.delete(k);
    setParams(p);
  };
  const chooseAirframe = (id: string) => setParam('airframeId', id);
  const chooseDays = (days: string) => setParam('days', days);
  return (
    <DeskPage title={t('trends.title')} showsLimits>
      <Panel>
        <div className="flex flex-wrap items-end gap-3">
          <Field label={t('trends.airframe')}>
            <Select value={airframeId ?? ''} onChange={(e) => chooseAirframe(e.target.value)}>
              <Options
                none={t('trends.choose')}
                items={airframes.data}
                value={(a) => a.id}
                label={(a) => a.fleetNumber}
              />
            </Select>
          </Field>
          <Field label={t('trends.window')}>
            <Select value={days} onChange={(e) => chooseDays(e.target.value)}>
              {[7, 30, 90, 365].map((d) => (
                <option key={d} value={d}>
                  {t('trends.lastDays', { count: d })}
                </option>
              ))}
            </Select>
          </Field>
          {trends.data && (
            <p className="text-ink-muted">
              {t('trends.alertLevel', {
                typeCode: trends.data.airframe.typeCode,
                threshold: new Intl.NumberFormat(i18n.language, { useGrouping: false }).format(
                  trends.data.thresholdLPerFh,
                ),
              })}
            </p>
          )}
        </div>
      </Panel>
      <ServerError error={trends.error} title={t('trends.notLoaded')} />
      {trends.data?.systems.map((s) => (
        <Panel key={s.system} title={s.label}>
          <p>
            {t('trends.added', {
              litres: fixed(s.window.litresAdded, 2, i18n.language),
              hours: fixed(s.window.flightHours, 1, i18n.language),
              days: s.window.days,
            })}
            {s.window.litresPerFlightHour !== null
              ? t('trends.rate', { rate: fixed(s.window.litresPerFlightHour, 3, i18n.language) })
              : '.'}
          </p>
          {s.levels.length === 0 && s.ratePerFh.length === 0 ? (
            <p className="text-ink-muted">{t('trends.noReadings')}</p>
          ) : (
            <TrendChart system={s} threshold={trends.data.thresholdLPerFh} days={trends.data.days} />
          )}
          {s.alerts.length === 0 ? (
            <p>{t('trends.noAlerts')}</p>
          ) : (
            s.alerts.map((a, i) => (
              <Notice key={i} tone="warning" title={t(alertTitles[a.kind])}>
                {phraseWords(a.message)}{' '}
                <span className="text-[17px]">
                  {t('trends.checksBehind')}{' '}
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
  const { t } = useTranslation('records');
  const verify = useVerifyTrail();
  const events = useAuditEvents();
  return (
    <DeskPage title={t('audit.title')}>
      <Panel>
        <div className="flex items-center gap-3">
          <Button tone="primary" disabled={verify.isPending} onClick={() => verify.mutate()}>
            {verify.isPending ? t('audit.verifying') : t('audit.verify')}
          </Button>
          <span className="text-ink-muted">{t('audit.intro')}</span>
        </div>
        <ServerError error={verify.error} title={t('audit.notVerified')} />
        {verify.data &&
          (verify.data.ok ? (
            <Notice tone="normal" title={t('audit.verifies')}>
              {t('audit.verifiesBody', {
                count: verify.data.events,
                time: recordTime(verify.data.checkedAt),
              })}
            </Notice>
          ) : (
            <Notice tone="warning" title={t('audit.broken')}>
              {t('audit.firstBroken', { id: verify.data.firstBroken?.id })} (
              {auditActionLabel(verify.data.firstBroken?.action ?? '')}
              {verify.data.firstBroken?.entity === 'check' ? (
                <>
                  {', '}
                  <Link className="underline" to={`/desk/records/${verify.data.firstBroken.entityId}`}>
                    {t('audit.theCheckRecord')}
                  </Link>
                </>
              ) : null}
              ): {verify.data.firstBroken?.reason}.
            </Notice>
          ))}
      </Panel>
      <Panel title={t('audit.latest')}>
        {events.isPending ? (
          <Loading what={t('audit.loadingWhat')} />
        ) : events.isError ? (
          <ServerError error={events.error} />
        ) : (
          <DeskTable>
            <thead>
              <tr>
                <th>#</th>
                <th>{t('audit.at')}</th>
                <th>{t('audit.who')}</th>
                <th>{t('audit.what')}</th>
                <th>{t('audit.on')}</th>
                <th>{t('audit.hash')}</th>
              </tr>
            </thead>
            <tbody>
              {events.data.map((e) => (
                <tr key={e.id}>
                  <td className="tabular">{e.id}</td>
                  <td>{recordTime(e.at)}</td>
                  <td>{e.actor ?? t('audit.system')}</td>
                  <td>{auditActionLabel(e.action)}</td>
                  <td>
                    {e.entity === 'check' ? (
                      <Link className="underline" to={`/desk/records/${e.entityId}`}>
                        {t('audit.theCheckRecord')}
                      </Link>
                    ) : (
                      plainName(e.entity).toLowerCase()
                    )}
                  </td>
                  <td className="font-mono text-[14px]">{e.hash.slice(0, 12)}…</td>
                </tr>
              ))}
            </tbody>
          </DeskTable>
        )}
      </Panel>
    </DeskPage>
  );
}
