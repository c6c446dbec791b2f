import type { CheckKind } from '@shared/schemas/limits';

/**
 * Every cache key the client uses, one factory per resource, nested so that invalidating a prefix reaches every
 * view of it: `queryKeys.airframes.all` refreshes the lists, the board, a pilot's view, the tech log and the
 * check cards at once. The same endpoint is cached under one key only, whichever screen asks.
 */
export const queryKeys = {
  session: ['session'] as const,
  airframes: {
    all: ['airframes'] as const,
    /** `GET /api/airframes`; a TV's board link reads the same list through its token. */
    list: (boardToken: string | null = null, bases: string | null = null) =>
      boardToken === null && bases === null
        ? (['airframes', 'list'] as const)
        : (['airframes', 'list', { board: boardToken, bases }] as const),
    one: (id: number) => ['airframes', id] as const,
    checkCard: (id: number, kind: CheckKind) => ['airframes', id, 'card', kind] as const,
    acceptanceView: (id: number) => ['airframes', id, 'acceptance-view'] as const,
    defects: (id: number) => ['airframes', id, 'defects'] as const,
    releases: (id: number) => ['airframes', id, 'releases'] as const,
  },
  tags: (token: string) => ['tags', token] as const,
  checks: { one: (id: string) => ['checks', id] as const, drafts: ['check-drafts'] as const },
  holds: { all: ['holds'] as const, one: (id: number) => ['holds', id] as const },
  handover: (from: string, to: string) => ['handover', from, to] as const,
  mailOutbox: ['mail', 'outbox'] as const,
  kiosks: ['kiosks'] as const,
  boardLinks: ['board-links'] as const,
  fleet: {
    all: ['fleet'] as const,
    airframes: ['fleet', 'airframes'] as const,
    bases: ['fleet', 'bases'] as const,
    tagSheet: (ids: number[] | null) => ['fleet', 'tag-sheet', ids?.join(',') ?? 'all'] as const,
  },
  /** `GET /api/tools`: the register, read by the desk page and by the kiosk's tool pickers. */
  tools: ['tools'] as const,
  staff: {
    all: ['staff'] as const,
    badgeCards: (ids: number[] | null) => ['staff', 'badge-cards', ids?.join(',') ?? 'all'] as const,
    authorisations: (staffId: number) => ['staff', staffId, 'authorisations'] as const,
  },
  types: {
    all: ['types'] as const,
    one: (id: number) => ['types', id] as const,
    version: (typeId: number, versionId: number) => ['types', typeId, 'versions', versionId] as const,
    diff: (typeId: number, from: number, to: number) => ['types', typeId, 'diff', from, to] as const,
  },
  records: {
    search: (query: string) => ['records', 'search', query] as const,
    one: (checkId: string) => ['records', 'check', checkId] as const,
    trends: (airframeId: number | null, days: number) => ['records', 'trends', airframeId, days] as const,
    auditEvents: ['records', 'audit-events'] as const,
  },
};
