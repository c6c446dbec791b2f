import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  createTypeSchema,
  type CreateType,
  type PublicationProblem,
} from '@shared/schemas/engineering-types';
import { phraseWords } from '@shared/i18n/phrase';
import { useTypes } from '@/lib/shared-queries';
import {
  getLimitsVersion,
  useCreateType,
  useLimitsDiff,
  useLimitsVersion,
  usePublishDraft,
  useSaveDraft,
  useType,
} from '../api/types';
import { DeskPage, Loading, Panel, ServerError, DeskTable } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { recordTime } from '@/lib/when';
import { fieldError } from '@/lib/field-error';
import { LimitsDiffView } from './limits-diff-view';
import { TypeEditor } from './type-editor';
import { Notice } from '@/components/ui/notice';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';

function NewTypeForm() {
  const { t } = useTranslation('engineeringTypes');
  const types = useTypes();
  const create = useCreateType();
  const navigate = useNavigate();
  const [copyFrom, setCopyFrom] = useState('');
  const { register, handleSubmit, formState } = useForm<
    z.input<typeof createTypeSchema>,
    unknown,
    CreateType
  >({
    resolver: zodResolver(createTypeSchema),
    defaultValues: { code: '', name: '' },
  });
  return (
    <Panel title={t('newType.title')}>
      <form
        noValidate
        className="grid grid-cols-[180px_1fr_260px_auto] items-start gap-3"
        onSubmit={(e) =>
          void handleSubmit(async (values) => {
            const source = types.data?.find((type) => String(type.id) === copyFrom)?.current;
            const definition = source
              ? (await getLimitsVersion(Number(copyFrom), source.id)).definition
              : undefined;
            create.mutate(
              {
                ...values,
                ...(definition
                  ? { definition: { ...definition, code: values.code, name: values.name } }
                  : {}),
              },
              { onSuccess: (r) => void navigate(`/desk/types/${r.id}`) },
            );
          })(e)
        }
      >
        <Field label={t('newType.code')} error={fieldError(formState.errors.code?.message)}>
          <Input {...register('code')} placeholder={t('newType.codePlaceholder')} />
        </Field>
        <Field label={t('newType.name')} error={fieldError(formState.errors.name?.message)}>
          <Input {...register('name')} placeholder={t('newType.namePlaceholder')} />
        </Field>
        <Field label={t('newType.startFrom')} hint={t('newType.startFromHint')}>
          <Select value={copyFrom} onChange={(e) => setCopyFrom(e.target.value)}>
            <option value="">{t('newType.starter')}</option>
            {types.data
              ?.filter((type) => type.current)
              .map((type) => (
                <option key={type.id} value={type.id}>
                  {t('newType.copyOf', { code: type.code, version: type.current!.version })}
                </option>
              ))}
          </Select>
        </Field>
        <Button type="submit" tone="primary" className="mt-6" disabled={create.isPending}>
          {t('newType.create')}
        </Button>
      </form>
      <ServerError error={create.error} title={t('newType.notCreated')} />
    </Panel>
  );
}

export function TypesPage() {
  const { t } = useTranslation('engineeringTypes');
  const types = useTypes();
  return (
    <DeskPage title={t('types.title')} showsLimits>
      <Panel>
        {types.isPending ? (
          <Loading what={t('types.loadingWhat')} />
        ) : types.isError ? (
          <ServerError error={types.error} title={t('types.notLoaded')} />
        ) : (
          <DeskTable>
            <thead>
              <tr>
                <th>{t('types.code')}</th>
                <th>{t('types.name')}</th>
                <th>{t('types.published')}</th>
                <th>{t('types.draft')}</th>
                <th>{t('types.airframes')}</th>
              </tr>
            </thead>
            <tbody>
              {types.data.map((type) => (
                <tr key={type.id}>
                  <td>
                    <Link className="font-semibold underline" to={`/desk/types/${type.id}`}>
                      {type.code}
                    </Link>
                  </td>
                  <td>{type.name}</td>
                  <td>
                    {type.current
                      ? t('types.publishedWords', {
                          version: type.current.version,
                          time: recordTime(type.current.publishedAt),
                          by: type.current.publishedBy ?? t('types.seed'),
                        })
                      : t('types.noneYet')}
                  </td>
                  <td>{type.draft ? t('types.draftInProgress', { version: type.draft.version }) : '—'}</td>
                  <td className="tabular">{type.airframes}</td>
                </tr>
              ))}
            </tbody>
          </DeskTable>
        )}
      </Panel>
      <NewTypeForm />
    </DeskPage>
  );
}

function PublishProblems({ error }: { error: unknown }) {
  const { t } = useTranslation('engineeringTypes');
  if (!(error instanceof ApiRequestError))
    return <ServerError error={error} title={t('publish.notPublished')} />;
  // Each problem is a phrase of this screen's catalogue (engineeringTypes:problems), read in the screen's language.
  const problems = (error.body.problems ?? []) as PublicationProblem[];
  return (
    <Notice tone="warning" title={t('publish.notPublished')}>
      {problems.length === 0 ? (
        error.message
      ) : (
        <ul className="list-disc pl-6 text-[17px]">
          {problems.map((p, i) => (
            <li key={i}>{phraseWords(p.reason)}</li>
          ))}
        </ul>
      )}
    </Notice>
  );
}

const compareSides = ['from', 'to'] as const;

export function TypePage() {
  const { t } = useTranslation('engineeringTypes');
  const typeId = Number(useParams().id);
  const type = useType(typeId);
  const [viewing, setViewing] = useState<number | null>(null);
  const [compare, setCompare] = useState<{ from: number | null; to: number | null }>({
    from: null,
    to: null,
  });
  const save = useSaveDraft(typeId);
  const publish = usePublishDraft(typeId);
  const editable = type.data?.draft?.id ?? type.data?.current?.id ?? null;
  const shown = viewing ?? editable;
  const version = useLimitsVersion(typeId, shown);
  const diff = useLimitsDiff(typeId, compare.from, compare.to);

  if (type.isPending) return <Loading what={t('type.loadingWhat')} />;
  if (type.isError) return <ServerError error={type.error} title={t('type.notLoaded')} />;
  const info = type.data;
  const isDraft = version.data?.status === 'draft';
  return (
    <DeskPage
      title={`${info.code} · ${info.name}`}
      showsLimits
      actions={
        <Link to="/desk/types" className="underline">
          {t('type.allTypes')}
        </Link>
      }
    >
      <Panel title={t('versions.title')}>
        <DeskTable>
          <thead>
            <tr>
              <th>{t('versions.version')}</th>
              <th>{t('versions.status')}</th>
              <th>{t('versions.published')}</th>
              <th>{t('versions.by')}</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {info.versions.map((v) => (
              <tr key={v.id} className={v.id === shown ? 'bg-ink-raised' : ''}>
                <td className="tabular">{t('versions.v', { version: v.version })}</td>
                <td>
                  {v.status === 'draft'
                    ? t('versions.draft')
                    : v.id === info.current?.id
                      ? t('versions.inUse')
                      : t('versions.superseded')}
                </td>
                <td>{recordTime(v.publishedAt)}</td>
                <td>{v.publishedBy ?? '—'}</td>
                <td className="flex gap-2">
                  <Button className="h-8" onClick={() => setViewing(v.id)}>
                    {v.status === 'draft' ? t('versions.edit') : t('versions.view')}
                  </Button>
                  <Button
                    className="h-8"
                    tone="quiet"
                    onClick={() => {
                      const other = info.versions[0]!.id === v.id ? info.versions[1] : info.versions[0];
                      // Versions are listed newest first; the older one goes on the left.
                      if (other)
                        setCompare(
                          other.version < v.version
                            ? { from: other.id, to: v.id }
                            : { from: v.id, to: other.id },
                        );
                    }}
                  >
                    {info.versions[0]!.id === v.id
                      ? t('versions.compareWithPrevious')
                      : t('versions.compareWithNewest')}
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </DeskTable>
        {info.draft && (
          <div className="flex flex-wrap items-center gap-3">
            <Button tone="primary" disabled={publish.isPending} onClick={() => publish.mutate()}>
              {t('publish.publishAs', { version: info.draft.version })}
            </Button>
            <span className="text-ink-muted">{t('publish.note')}</span>
          </div>
        )}
        {publish.isError && <PublishProblems error={publish.error} />}
        {publish.isSuccess && (
          <Notice tone="normal" title={t('publish.published', { version: publish.data.version })}>
            {t('publish.publishedAt', { time: recordTime(publish.data.publishedAt) })}
          </Notice>
        )}
      </Panel>

      <Panel title={t('compare.title')}>
        <div className="flex flex-wrap items-end gap-3">
          {compareSides.map((side) => (
            <Field key={side} label={side === 'from' ? t('compare.older') : t('compare.newer')}>
              <Select
                value={compare[side] ?? ''}
                onChange={(e) =>
                  setCompare((c) => ({ ...c, [side]: e.target.value ? Number(e.target.value) : null }))
                }
              >
                <Options
                  none={t('compare.choose')}
                  items={info.versions}
                  value={(v) => v.id}
                  label={(v) => t('compare.option', { version: v.version, status: t(`status.${v.status}`) })}
                />
              </Select>
            </Field>
          ))}
        </div>
        {diff.isError && <ServerError error={diff.error} title={t('compare.none')} />}
        {diff.data && <LimitsDiffView diff={diff.data} />}
      </Panel>

      {version.data && (
        <>
          {!isDraft && (
            <Notice tone="info" title={t('type.publishedFixed', { version: version.data.version })}>
              {info.draft
                ? t('type.savingStartsDraft', { version: info.draft.version })
                : t('type.savingStartsNew')}
            </Notice>
          )}
          <TypeEditor
            key={`${version.data.id}-${save.data?.id ?? ''}`}
            initial={version.data.definition}
            saving={save.isPending}
            saveError={save.error}
            readOnly={false}
            onSave={(definition) => save.mutate(definition, { onSuccess: (r) => setViewing(r.id) })}
          />
        </>
      )}
      {version.isError && <ServerError error={version.error} title={t('type.versionNotLoaded')} />}
    </DeskPage>
  );
}
