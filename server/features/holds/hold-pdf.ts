import { formatInstant } from '@shared/domain/when';
import { signedCheckView, type SignedCheckView } from '@server/db/signed-check-view';
import { signedAuthorisationWords } from '@server/db/authorisation-records';
import { notFound, refusal } from '@server/errors/app-error';
import { RecordDocument } from '@server/pdf/record-document';
import { drawSignedCheck, signatureLines, type PhotoBytes } from '@server/pdf/signed-check-section';
import { englishPrint, inSentence, type PrintWords } from '@server/pdf/print-words';
import { correctiveActionsOf, countersignsOf, defectOfHold, findHold, people } from './holds.repository';

interface SignedBy {
  signer: { badge: string; name: string; licence: string | null };
  signedAt: string;
}

interface SignedCountersign extends SignedBy {
  decision: 'release' | 'keep';
  reason: string | null;
  statement: string | null;
  authorisation: unknown;
  recheck: { id: string; contentHash: string } | null;
}

interface SignedInspection extends SignedBy {
  text: string;
}

type HoldFacts = Awaited<ReturnType<typeof holdFacts>>;

async function holdFacts(id: number, words: PrintWords) {
  const hold = await findHold(id);
  if (!hold) throw notFound(refusal('holds.notFound'));
  const [held, actions, countersigns, { defect, inspections }] = await Promise.all([
    signedCheckView(hold.checkId, words),
    correctiveActionsOf([hold.id]),
    countersignsOf([hold.id]),
    defectOfHold(hold.id),
  ]);
  const names = await people(actions.map((a) => a.recordedBy));
  const signed = countersigns.map((c) => ({
    row: c,
    content: JSON.parse(c.signedContent) as SignedCountersign,
  }));
  const rechecks = await Promise.all(
    signed.map((c) =>
      c.content.recheck ? signedCheckView(c.content.recheck.id, words) : Promise.resolve(null),
    ),
  );
  return { hold, held, actions, names, signed, rechecks, defect, inspections };
}

function drawFinding(doc: RecordDocument, f: HoldFacts, words: PrintWords) {
  const { hold, held, defect } = f;
  const { pdf } = words;
  const at = (when: Date | string) => formatInstant(when, 'UTC', words.language);
  doc.section(pdf('hold.title')).facts([
    [pdf('hold.number'), String(hold.id)],
    [pdf('hold.defect'), defect ? String(defect.id) : null],
    [pdf('hold.opened'), at(hold.openedAt)],
    [
      pdf('hold.state'),
      hold.releasedAt ? pdf('hold.released', { at: at(hold.releasedAt) }) : pdf('hold.open'),
    ],
  ]);
  doc.section(pdf('hold.finding'));
  for (const r of held.readings.filter((x) => x.verdict === 'out_of_limits')) {
    doc.item(`${r.label}: ${r.entered}, ${inSentence(r.verdictWords, words)}`, [
      pdf('readings.limit', { limit: r.limitText }),
      r.message,
    ]);
  }
  doc.paragraph(
    pdf('hold.foundAt', {
      kind: inSentence(held.kindWords, words),
      at: at(held.signedAt),
      name: held.signer.name,
    }),
  );
}

function drawWork(doc: RecordDocument, f: HoldFacts, words: PrintWords) {
  const { pdf } = words;
  doc.section(pdf('hold.correctiveAction'));
  if (f.actions.length === 0) doc.paragraph(pdf('hold.noneYet'));
  for (const a of f.actions) {
    doc.item(a.text, [
      pdf('hold.recordedBy', {
        name: f.names.get(a.recordedBy)?.name ?? pdf('hold.unknown'),
        at: formatInstant(a.recordedAt, 'UTC', words.language),
      }),
      a.independentInspection ? pdf('hold.needsInspection') : '',
    ]);
  }
  if (f.inspections.length === 0) return;
  doc.section(pdf('hold.inspection'));
  for (const i of f.inspections) {
    const content = JSON.parse(i.signedContent) as SignedInspection;
    doc.item(content.text, signatureLines(content.signer, content.signedAt, i.contentHash, null, words));
  }
}

const recheckWords = (v: SignedCheckView | null, words: PrintWords) =>
  v
    ? words.pdf('hold.recheck', {
        kind: inSentence(v.kindWords, words),
        at: formatInstant(v.signedAt, 'UTC', words.language),
        name: v.signer.name,
      })
    : '';

function drawCountersigns(doc: RecordDocument, f: HoldFacts, words: PrintWords) {
  const { pdf } = words;
  doc.section(pdf('hold.countersign'));
  if (f.signed.length === 0) doc.paragraph(pdf('hold.noCountersign'));
  f.signed.forEach(({ row, content }, i) => {
    const head =
      content.decision === 'release'
        ? pdf('hold.releasedCrs')
        : `${pdf('hold.kept')}${content.reason ? `: ${content.reason}` : ''}`;
    doc.item(head, [
      content.statement ?? '',
      content.decision === 'release' && content.reason ? pdf('hold.note', { note: content.reason }) : '',
      recheckWords(f.rechecks[i] ?? null, words),
      ...signatureLines(
        content.signer,
        content.signedAt,
        row.contentHash,
        signedAuthorisationWords(content.authorisation, words.t),
        words,
      ),
    ]);
  });
}

/** One hold as a printable record: finding, corrective action, inspection, countersigns and the held check. */
export async function holdPdf(
  id: number,
  print: { operator: string; deskUrl: string; photoBytes: PhotoBytes },
  words: PrintWords = englishPrint(),
): Promise<{ bytes: Buffer; fileName: string }> {
  const f = await holdFacts(id, words);
  const release = f.signed.find((c) => c.content.decision === 'release');
  const pdf = await RecordDocument.open({
    operator: print.operator,
    title: words.pdf('hold.recordTitle', { id: f.hold.id }),
    subtitle: [f.held.registration, words.pdf('fleetNumber', { fleet: f.held.fleetNumber }), f.held.typeCode]
      .filter(Boolean)
      .join(', '),
    hash: release?.row.contentHash ?? f.held.contentHash,
    deskUrl: print.deskUrl,
    words,
  });
  drawFinding(pdf, f, words);
  drawWork(pdf, f, words);
  drawCountersigns(pdf, f, words);
  pdf.section(words.pdf('hold.heldCheck'));
  await drawSignedCheck(pdf, f.held, print.photoBytes, words);
  return {
    bytes: await pdf.finish(),
    fileName: `${f.held.registration ?? f.held.fleetNumber} hold ${f.hold.id}.pdf`,
  };
}
