import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { kioskRenameSchema } from '../../../../shared/schemas/engineering';
import {
  useBoardLinks,
  useDeskKiosks,
  useRenameKiosk,
  useRevokeBoardLink,
  useRevokeDeskKiosk,
  type KioskRow,
} from '../api/kiosks';
import { DeskButton, DeskPage, Input, Loading, Panel, ServerError, tableClass, when } from './desk-ui';

function RenameForm({ kiosk, onDone }: { kiosk: KioskRow; onDone: () => void }) {
  const rename = useRenameKiosk();
  const { register, handleSubmit, formState } = useForm<{ name: string }>({
    resolver: zodResolver(kioskRenameSchema),
    defaultValues: { name: kiosk.name },
  });
  return (
    <form
      noValidate
      className="flex items-start gap-2"
      onSubmit={handleSubmit((v) => rename.mutate({ id: kiosk.id, name: v.name }, { onSuccess: onDone }))}
    >
      <div className="flex flex-col">
        <Input aria-label="Tablet name" className="h-8 w-[260px]" {...register('name')} />
        {formState.errors.name && <span className="text-warning-text">{formState.errors.name.message}</span>}
        {rename.isError && <ServerError error={rename.error} title="Not renamed" />}
      </div>
      <DeskButton type="submit" className="h-8" tone="primary">
        Save
      </DeskButton>
      <DeskButton className="h-8" tone="quiet" onClick={onDone}>
        Cancel
      </DeskButton>
    </form>
  );
}

const stateWords = {
  enrolled: '● enrolled',
  awaiting_enrolment: '○ waiting for enrolment',
  revoked: '✕ revoked',
} as const;

export function TabletsPage() {
  const kiosks = useDeskKiosks();
  const links = useBoardLinks();
  const revoke = useRevokeDeskKiosk();
  const revokeLink = useRevokeBoardLink();
  const [renaming, setRenaming] = useState<number | null>(null);
  const [confirm, setConfirm] = useState<string | null>(null);
  return (
    <DeskPage title="Kiosk tablets and board links">
      <ServerError error={revoke.error ?? revokeLink.error} title="Not revoked" />
      <Panel title="Kiosk tablets">
        {kiosks.isPending ? (
          <Loading what="tablets" />
        ) : kiosks.isError ? (
          <ServerError error={kiosks.error} />
        ) : (
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Name</th>
                <th>State</th>
                <th>Enrolled</th>
                <th>Last seen</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {kiosks.data.map((k) => (
                <tr key={k.id} className={k.state === 'revoked' ? 'text-ink-muted' : ''}>
                  <td>
                    {renaming === k.id ? (
                      <RenameForm kiosk={k} onDone={() => setRenaming(null)} />
                    ) : (
                      <span className="font-semibold">{k.name}</span>
                    )}
                  </td>
                  <td>{stateWords[k.state]}</td>
                  <td>{when(k.enrolledAt)}</td>
                  <td>{when(k.lastSeenAt)}</td>
                  <td className="flex justify-end gap-2">
                    {k.state !== 'revoked' && renaming !== k.id && (
                      <>
                        <DeskButton className="h-8" onClick={() => setRenaming(k.id)}>
                          Rename
                        </DeskButton>
                        {confirm === `k${k.id}` ? (
                          <DeskButton
                            className="h-8"
                            tone="danger"
                            onClick={() => revoke.mutate(k.id, { onSettled: () => setConfirm(null) })}
                          >
                            Yes, revoke now
                          </DeskButton>
                        ) : (
                          <DeskButton className="h-8" onClick={() => setConfirm(`k${k.id}`)}>
                            Revoke
                          </DeskButton>
                        )}
                      </>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
      {links.data && (
        <Panel title="Board links (read-only hangar screens)">
          <table className={tableClass}>
            <thead>
              <tr>
                <th>Name</th>
                <th>Made by</th>
                <th>Made</th>
                <th>Last seen</th>
                <th>State</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {links.data.map((l) => (
                <tr key={l.id} className={l.revokedAt ? 'text-ink-muted' : ''}>
                  <td className="font-semibold">{l.name}</td>
                  <td>{l.createdBy}</td>
                  <td>{when(l.createdAt)}</td>
                  <td>{when(l.lastSeenAt)}</td>
                  <td>{l.revokedAt ? `✕ revoked ${when(l.revokedAt)}` : '● live'}</td>
                  <td className="text-right">
                    {!l.revokedAt &&
                      (confirm === `b${l.id}` ? (
                        <DeskButton
                          className="h-8"
                          tone="danger"
                          onClick={() => revokeLink.mutate(l.id, { onSettled: () => setConfirm(null) })}
                        >
                          Yes, revoke now
                        </DeskButton>
                      ) : (
                        <DeskButton className="h-8" onClick={() => setConfirm(`b${l.id}`)}>
                          Revoke
                        </DeskButton>
                      ))}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
      )}
    </DeskPage>
  );
}
