import { signedCheckView } from '@server/db/signed-check-view';
import { checkRecordProblem } from '@server/audit/record-integrity';
import { RecordDocument } from '@server/pdf/record-document';
import { drawSignedCheck, type PhotoBytes } from '@server/pdf/signed-check-section';
import { englishPrint, type PrintWords } from '@server/pdf/print-words';
import { checkKindLabel } from '@shared/schemas/plain';

/** One signed check as a printable record (PDF), every word from its signed content. */
export async function checkPdf(
  id: string,
  print: { operator: string; deskUrl: string; photoBytes: PhotoBytes },
  words: PrintWords = englishPrint(),
): Promise<{ bytes: Buffer; fileName: string }> {
  const [view, problem] = await Promise.all([signedCheckView(id, words), checkRecordProblem(id)]);
  const pdf = await RecordDocument.open({
    operator: print.operator,
    title: words.pdf('check.recordTitle', { kind: view.kindWords }),
    subtitle: [view.registration, words.pdf('fleetNumber', { fleet: view.fleetNumber }), view.typeCode]
      .filter(Boolean)
      .join(', '),
    hash: view.contentHash,
    deskUrl: print.deskUrl,
    words,
  });
  if (problem) {
    pdf.section(words.pdf('check.warning')).paragraph(words.pdf('check.warningText'));
  }
  await drawSignedCheck(pdf, view, print.photoBytes, words);
  const day = view.signedAt.slice(0, 10);
  // The file name stays in English words: it names the file, the same in every language.
  const english = words.language === 'en' ? view.kindWords : checkKindLabel(view.kind, englishPrint().t);
  return {
    bytes: await pdf.finish(),
    fileName: `${view.registration ?? view.fleetNumber} ${english} ${day}.pdf`,
  };
}
