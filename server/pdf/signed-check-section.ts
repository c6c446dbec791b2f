import { formatDay, formatInstant } from '@shared/domain/when';
import { typeWords } from '@shared/domain/words';
import type { SignedCheckView } from '@server/db/signed-check-view';
import type { RecordDocument } from './record-document';

/** The bytes of a stored photo, or null when the file is missing; given by the route that composes photos. */
export type PhotoBytes = (storedName: string) => Promise<Buffer | null>;

const hoursWords = (v: SignedCheckView) =>
  v.airframeHours === null ? null : `${v.airframeHours.toFixed(1)} flight hours`;

/** Who signed, under which licence, when (UTC) and the hash of exactly what was signed (AC 120-78B). */
export function signatureLines(
  signer: { name: string; badge?: string | null; licence?: string | null },
  signedAt: string,
  hash: string,
  authorisation?: string | null,
): string[] {
  return [
    `Signed by ${signer.name}${signer.badge ? `, badge ${signer.badge}` : ''}`,
    `Licence: ${signer.licence ?? 'none recorded'}${authorisation ? `; authorisation ${authorisation}` : ''}`,
    `Signed ${formatInstant(signedAt)}`,
    `Signature hash (SHA-256): ${hash}`,
  ];
}

function drawAirframe(pdf: RecordDocument, v: SignedCheckView) {
  pdf.section('Aircraft').facts([
    [
      'Registration mark',
      v.registration
        ? `${v.registration}${v.registrationSigned ? '' : ' (as registered now)'}`
        : 'not recorded',
    ],
    ['Fleet number', v.fleetNumber],
    ['Type', typeWords({ code: v.typeCode, name: v.typeName })],
    ['Serial number', v.serial],
    ['Hours at the check', hoursWords(v)],
    ['Flights at the check', v.airframeFlights === null ? null : String(v.airframeFlights)],
  ]);
}

function drawReadings(pdf: RecordDocument, v: SignedCheckView) {
  pdf.section(`Readings against limits version ${v.limitsVersion}`);
  if (v.contextWords) pdf.paragraph(`Conditions: ${v.contextWords}`);
  for (const r of v.readings) {
    pdf.item(`${r.label}: ${r.entered}, ${r.verdictWords.toLowerCase()}`, [
      `Limit: ${r.limitText}`,
      r.message,
      r.toolWords ? `Taken with ${r.toolWords}` : '',
      r.reference ? `From: ${r.reference}` : '',
    ]);
  }
}

function drawServicing(pdf: RecordDocument, v: SignedCheckView) {
  if (v.servicing.length === 0) return;
  pdf.section('Fluid added');
  for (const s of v.servicing) {
    pdf.item(`${s.label}: ${s.quantityWords} of ${s.fluidSpec}`, [
      `Batch ${s.batch}`,
      s.canOpenedOn ? `Can opened ${formatDay(s.canOpenedOn)}` : '',
      `Level before the top-up: ${s.levelBeforeWords}`,
      ...(s.tools ?? []).map(
        (t) =>
          `Tool: ${t.name}${t.serial ? `, serial ${t.serial}` : ''}` +
          (t.calibrationDueOn ? `, calibration due ${formatDay(t.calibrationDueOn)}` : ''),
      ),
    ]);
  }
}

async function drawPhotos(pdf: RecordDocument, v: SignedCheckView, photoBytes: PhotoBytes) {
  if (v.photos.length === 0) return;
  pdf.section('Photos');
  for (const p of v.photos) {
    const caption = `${p.label}. Photo fingerprint (SHA-256) ${p.sha256}`;
    const printable = p.mimeType === 'image/jpeg' || p.mimeType === 'image/png';
    const bytes = p.storedName && printable ? await photoBytes(p.storedName) : null;
    if (bytes) pdf.thumbnail(bytes, caption);
    else
      pdf.item(caption, [
        p.storedName
          ? 'A WebP photo cannot be printed; open the record on the desk.'
          : 'The photo file is missing.',
      ]);
  }
}

/** The whole signed check: aircraft, readings, fluid, photos, note and signature, all as signed. */
export async function drawSignedCheck(pdf: RecordDocument, v: SignedCheckView, photoBytes: PhotoBytes) {
  drawAirframe(pdf, v);
  pdf.section('Check').facts([
    ['Kind', v.kindWords],
    ['Verdict', v.verdictWords],
    ['Signed', formatInstant(v.signedAt)],
  ]);
  drawReadings(pdf, v);
  drawServicing(pdf, v);
  if (v.note) pdf.section('Note').paragraph(v.note);
  await drawPhotos(pdf, v, photoBytes);
  pdf.section('Signature');
  pdf.item(v.signer.name, signatureLines(v.signer, v.signedAt, v.contentHash));
}
