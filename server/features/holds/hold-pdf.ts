import { formatInstant } from '@shared/domain/when';
import { signedCheckView, type SignedCheckView } from '@server/db/signed-check-view';
import { signedAuthorisationWords } from '@server/db/authorisation-records';
import { notFound } from '@server/errors/app-error';
import { RecordDocument } from '@server/pdf/record-document';
import { drawSignedCheck, signatureLines, type PhotoBytes } from '@server/pdf/signed-check-section';
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

async function holdFacts(id: number) {
  const hold = await findHold(id);
  if (!hold) throw notFound(`No hold with id ${id}.`);
  const [held, actions, countersigns, { defect, inspections }] = await Promise.all([
    signedCheckView(hold.checkId),
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
    signed.map((c) => (c.content.recheck ? signedCheckView(c.content.recheck.id) : Promise.resolve(null))),
  );
  return { hold, held, actions, names, signed, rechecks, defect, inspections };
}

function drawFinding(pdf: RecordDocument, f: HoldFacts) {
  const { hold, held, defect } = f;
  pdf.section('Hold').facts([
    ['Hold number', String(hold.id)],
    ['Tech-log defect', defect ? String(defect.id) : null],
    ['Opened', formatInstant(hold.openedAt)],
    ['State', hold.releasedAt ? `Released ${formatInstant(hold.releasedAt)}` : 'Open: the airframe is held'],
  ]);
  pdf.section('Finding');
  for (const r of held.readings.filter((x) => x.verdict === 'out_of_limits')) {
    pdf.item(`${r.label}: ${r.entered}, ${r.verdictWords.toLowerCase()}`, [
      `Limit: ${r.limitText}`,
      r.message,
    ]);
  }
  pdf.paragraph(
    `Found at the ${held.kindWords.toLowerCase()} check signed ${formatInstant(held.signedAt)} by ${held.signer.name}.`,
  );
}

function drawWork(pdf: RecordDocument, f: HoldFacts) {
  pdf.section('Corrective action');
  if (f.actions.length === 0) pdf.paragraph('None recorded yet.');
  for (const a of f.actions) {
    pdf.item(a.text, [
      `Recorded by ${f.names.get(a.recordedBy)?.name ?? 'unknown'}, ${formatInstant(a.recordedAt)}, with their PIN or password`,
      a.independentInspection ? 'The work asks for an independent inspection.' : '',
    ]);
  }
  if (f.inspections.length === 0) return;
  pdf.section('Independent inspection');
  for (const i of f.inspections) {
    const content = JSON.parse(i.signedContent) as SignedInspection;
    pdf.item(content.text, signatureLines(content.signer, content.signedAt, i.contentHash));
  }
}

const recheckWords = (v: SignedCheckView | null) =>
  v
    ? `Passing re-check: ${v.kindWords.toLowerCase()} check signed ${formatInstant(v.signedAt)} by ${v.signer.name}, in limits`
    : '';

function drawCountersigns(pdf: RecordDocument, f: HoldFacts) {
  pdf.section('Countersign and release');
  if (f.signed.length === 0) pdf.paragraph('No countersign yet.');
  f.signed.forEach(({ row, content }, i) => {
    const head =
      content.decision === 'release'
        ? 'Released: certificate of release to service'
        : `Kept on hold${content.reason ? `: ${content.reason}` : ''}`;
    pdf.item(head, [
      content.statement ?? '',
      content.decision === 'release' && content.reason ? `Note: ${content.reason}` : '',
      recheckWords(f.rechecks[i] ?? null),
      ...signatureLines(
        content.signer,
        content.signedAt,
        row.contentHash,
        signedAuthorisationWords(content.authorisation),
      ),
    ]);
  });
}

/** One hold as a printable record: finding, corrective action, inspection, countersigns and the held check. */
export async function holdPdf(
  id: number,
  print: { operator: string; deskUrl: string; photoBytes: PhotoBytes },
): Promise<{ bytes: Buffer; fileName: string }> {
  const f = await holdFacts(id);
  const release = f.signed.find((c) => c.content.decision === 'release');
  const pdf = await RecordDocument.open({
    operator: print.operator,
    title: `Hold ${f.hold.id} record`,
    subtitle: [f.held.registration, `fleet number ${f.held.fleetNumber}`, f.held.typeCode]
      .filter(Boolean)
      .join(', '),
    hash: release?.row.contentHash ?? f.held.contentHash,
    deskUrl: print.deskUrl,
  });
  drawFinding(pdf, f);
  drawWork(pdf, f);
  drawCountersigns(pdf, f);
  pdf.section('The held check, as signed');
  await drawSignedCheck(pdf, f.held, print.photoBytes);
  return {
    bytes: await pdf.finish(),
    fileName: `${f.held.registration ?? f.held.fleetNumber} hold ${f.hold.id}.pdf`,
  };
}
