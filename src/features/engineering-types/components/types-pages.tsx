import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '@hookform/resolvers/zod';
import { createTypeSchema, type CreateType } from '@shared/schemas/engineering-types';
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
import { DeskPage, Loading, Panel, ServerError, tableClass } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { recordTime } from '@/lib/when';
import { LimitsDiffView } from './limits-diff-view';
import { TypeEditor } from './type-editor';
import { Notice } from '@/components/ui/notice';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';

function NewTypeForm() {
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
    <Panel title="New type">
      <form
        noValidate
        className="grid grid-cols-[180px_1fr_260px_auto] items-start gap-3"
        onSubmit={(e) =>
          void handleSubmit(async (values) => {
            const source = types.data?.find((t) => String(t.id) === copyFrom)?.current;
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
        <Field label="Code" error={formState.errors.code?.message}>
          <Input {...register('code')} placeholder="RX-5" />
        </Field>
        <Field label="Name" error={formState.errors.name?.message}>
          <Input {...register('name')} placeholder="Medium twin" />
        </Field>
        <Field label="Start from" hint="a copy of a published type, or a starter">
          <Select value={copyFrom} onChange={(e) => setCopyFrom(e.target.value)}>
            <option value="">starter (one light single)</option>
            {types.data
              ?.filter((t) => t.current)
              .map((t) => (
                <option key={t.id} value={t.id}>
                  copy of {t.code} v{t.current!.version}
                </option>
              ))}
          </Select>
        </Field>
        <Button type="submit" tone="primary" className="mt-6" disabled={create.isPending}>
          Create draft
        </Button>
      </form>
      <ServerError error={create.error} title="Type not created" />
    </Panel>
  );
}

export function TypesPage() {
  const types = useTypes();
  return (
    <DeskPage title="Types and check cards" showsLimits>
      <Panel>
        {types.isPending ? (
          <Loading what="types" />
        ) : types.isError ? (
          <ServerError error={types.error} title="Types not loaded" />
        ) : (
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Code</th>
                <th>Name</th>
                <th>Published limits</th>
                <th>Draft</th>
                <th>Airframes</th>
              </tr>
            </thead>
            <tbody>
              {types.data.map((t) => (
                <tr key={t.id}>
                  <td>
                    <Link className="font-semibold underline" to={`/desk/types/${t.id}`}>
                      {t.code}
                    </Link>
                  </td>
                  <td>{t.name}</td>
                  <td>
                    {t.current
                      ? `v${t.current.version}, ${recordTime(t.current.publishedAt)} by ${t.current.publishedBy ?? 'seed'}`
                      : 'none yet'}
                  </td>
                  <td>{t.draft ? `v${t.draft.version} in progress` : '—'}</td>
                  <td className="tabular">{t.airframes}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
      <NewTypeForm />
    </DeskPage>
  );
}

function PublishProblems({ error }: { error: unknown }) {
  if (!(error instanceof ApiRequestError)) return <ServerError error={error} title="Not published" />;
  const problems = (error.body.problems ?? []) as { checkpoint: string; message: string; bands?: string[] }[];
  return (
    <Notice tone="warning" title="Not published">
      {problems.length === 0 ? (
        error.message
      ) : (
        <ul className="list-disc pl-6 text-[17px]">
          {problems.map((p, i) => (
            <li key={i}>{p.message}</li>
          ))}
        </ul>
      )}
    </Notice>
  );
}

export function TypePage() {
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

  if (type.isPending) return <Loading what="type" />;
  if (type.isError) return <ServerError error={type.error} title="Type not loaded" />;
  const t = type.data;
  const isDraft = version.data?.status === 'draft';
  return (
    <DeskPage
      title={`${t.code} · ${t.name}`}
      showsLimits
      actions={
        <Link to="/desk/types" className="underline">
          All types
        </Link>
      }
    >
      <Panel title="Versions">
        <table className={tableClass}>
          <thead>
            <tr>
              <th>Version</th>
              <th>Status</th>
              <th>Published</th>
              <th>By</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {t.versions.map((v) => (
              <tr key={v.id} className={v.id === shown ? 'bg-ink-raised' : ''}>
                <td className="tabular">v{v.version}</td>
                <td>
                  {v.status === 'draft'
                    ? '✎ draft'
                    : v.id === t.current?.id
                      ? '● published, in use'
                      : '○ published, superseded'}
                </td>
                <td>{recordTime(v.publishedAt)}</td>
                <td>{v.publishedBy ?? '—'}</td>
                <td className="flex gap-2">
                  <Button className="h-8" onClick={() => setViewing(v.id)}>
                    {v.status === 'draft' ? 'Edit' : 'View'}
                  </Button>
                  <Button
                    className="h-8"
                    tone="quiet"
                    onClick={() => {
                      const other = t.versions[0]!.id === v.id ? t.versions[1] : t.versions[0];
                      // Versions are listed newest first; the older one goes on the left.
                      if (other)
                        setCompare(
                          other.version < v.version
                            ? { from: other.id, to: v.id }
                            : { from: v.id, to: other.id },
                        );
                    }}
                  >
                    Compare with {t.versions[0]!.id === v.id ? 'previous' : 'newest'}
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {t.draft && (
          <div className="flex flex-wrap items-center gap-3">
            <Button tone="primary" disabled={publish.isPending} onClick={() => publish.mutate()}>
              Publish draft as v{t.draft.version}
            </Button>
            <span className="text-ink-muted">
              New checks are judged by it at once; signed checks keep their version.
            </span>
          </div>
        )}
        {publish.isError && <PublishProblems error={publish.error} />}
        {publish.isSuccess && (
          <Notice tone="normal" title={`Version ${publish.data.version} published`}>
            Published {recordTime(publish.data.publishedAt)}.
          </Notice>
        )}
      </Panel>

      <Panel title="Compare two versions">
        <div className="flex flex-wrap items-end gap-3">
          {(['from', 'to'] as const).map((side) => (
            <Field key={side} label={side === 'from' ? 'Older' : 'Newer'}>
              <Select
                value={compare[side] ?? ''}
                onChange={(e) =>
                  setCompare((c) => ({ ...c, [side]: e.target.value ? Number(e.target.value) : null }))
                }
              >
                <Options
                  none="choose…"
                  items={t.versions}
                  value={(v) => v.id}
                  label={(v) => `v${v.version} (${v.status})`}
                />
              </Select>
            </Field>
          ))}
        </div>
        {diff.isError && <ServerError error={diff.error} title="No comparison" />}
        {diff.data && <LimitsDiffView diff={diff.data} />}
      </Panel>

      {version.data && (
        <>
          {!isDraft && (
            <Notice tone="info" title={`Version ${version.data.version} is published and can never change`}>
              Saving below starts {t.draft ? `the draft v${t.draft.version}` : 'a new draft'} from it.
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
      {version.isError && <ServerError error={version.error} title="Version not loaded" />}
    </DeskPage>
  );
}
