import { signedCheckView } from '@server/db/signed-check-view';
import { checkRecordProblem } from '@server/audit/record-integrity';
import { RecordDocument } from '@server/pdf/record-document';
import { drawSignedCheck, type PhotoBytes } from '@server/pdf/signed-check-section';

/** One signed check as a printable record (PDF), every word from its signed content. */
export async function checkPdf(
  id: string,
  print: { operator: string; deskUrl: string; photoBytes: PhotoBytes },
): Promise<{ bytes: Buffer; fileName: string }> {
  const [view, problem] = await Promise.all([signedCheckView(id), checkRecordProblem(id)]);
  const pdf = await RecordDocument.open({
    operator: print.operator,
    title: `${view.kindWords} check record`,
    subtitle: [view.registration, `fleet number ${view.fleetNumber}`, view.typeCode]
      .filter(Boolean)
      .join(', '),
    hash: view.contentHash,
    deskUrl: print.deskUrl,
  });
  if (problem) {
    pdf
      .section('Warning: this record does not match its signature')
      .paragraph(
        'The stored rows were changed after signing. What follows is what was signed; ask engineering to verify ' +
          'the audit trail.',
      );
  }
  await drawSignedCheck(pdf, view, print.photoBytes);
  const day = view.signedAt.slice(0, 10);
  return {
    bytes: await pdf.finish(),
    fileName: `${view.registration ?? view.fleetNumber} ${view.kindWords} ${day}.pdf`,
  };
}
