import { formatDay, formatInstant } from '@shared/domain/when';
import { localNumber, typeWords } from '@shared/domain/words';
import type { SignedCheckView } from '@server/db/signed-check-view';
import type { RecordDocument } from './record-document';
import { englishPrint, inSentence, type PrintWords } from './print-words';

/** The bytes of a stored photo, or null when the file is missing; given by the route that composes photos. */
export type PhotoBytes = (storedName: string) => Promise<Buffer | null>;

const hoursWords = (v: SignedCheckView, { t, pdf }: PrintWords) =>
  v.airframeHours === null ? null : pdf('aircraft.hoursValue', { hours: localNumber(v.airframeHours, 1, t) });

/** Who signed, under which licence, when (UTC) and the hash of exactly what was signed (AC 120-78B). */
export function signatureLines(
  signer: { name: string; badge?: string | null; licence?: string | null },
  signedAt: string,
  hash: string,
  authorisation?: string | null,
  { language, pdf }: PrintWords = englishPrint(),
): string[] {
  return [
    pdf('signature.signedBy', { name: signer.name }) +
      (signer.badge ? pdf('signature.badge', { badge: signer.badge }) : ''),
    pdf('signature.licence', { licence: signer.licence ?? pdf('signature.noLicence') }) +
      (authorisation ? pdf('signature.authorisation', { authorisation }) : ''),
    pdf('signature.signedAt', { at: formatInstant(signedAt, 'UTC', language) }),
    pdf('signature.hash', { hash }),
  ];
}

function drawAirframe(doc: RecordDocument, v: SignedCheckView, words: PrintWords) {
  const { pdf } = words;
  doc.section(pdf('aircraft.title')).facts([
    [
      pdf('aircraft.registration'),
      v.registration
        ? `${v.registration}${v.registrationSigned ? '' : pdf('aircraft.registeredNow')}`
        : pdf('aircraft.notRecorded'),
    ],
    [pdf('aircraft.fleetNumber'), v.fleetNumber],
    [pdf('aircraft.type'), typeWords({ code: v.typeCode, name: v.typeName })],
    [pdf('aircraft.serial'), v.serial],
    [pdf('aircraft.hours'), hoursWords(v, words)],
    [pdf('aircraft.flights'), v.airframeFlights === null ? null : String(v.airframeFlights)],
  ]);
}

function drawReadings(doc: RecordDocument, v: SignedCheckView, words: PrintWords) {
  const { pdf } = words;
  doc.section(pdf('readings.title', { version: v.limitsVersion }));
  if (v.contextWords) doc.paragraph(pdf('readings.conditions', { conditions: v.contextWords }));
  for (const r of v.readings) {
    doc.item(`${r.label}: ${r.entered}, ${inSentence(r.verdictWords, words)}`, [
      pdf('readings.limit', { limit: r.limitText }),
      r.message,
      r.toolWords ? pdf('readings.takenWith', { tool: r.toolWords }) : '',
      r.reference ? pdf('readings.from', { reference: r.reference }) : '',
    ]);
  }
}

function drawServicing(doc: RecordDocument, v: SignedCheckView, { language, pdf }: PrintWords) {
  if (v.servicing.length === 0) return;
  doc.section(pdf('fluid.title'));
  for (const s of v.servicing) {
    doc.item(pdf('fluid.line', { label: s.label, quantity: s.quantityWords, fluid: s.fluidSpec }), [
      pdf('fluid.batch', { batch: s.batch }),
      s.canOpenedOn ? pdf('fluid.canOpened', { day: formatDay(s.canOpenedOn, language) }) : '',
      pdf('fluid.levelBefore', { level: s.levelBeforeWords }),
      ...(s.tools ?? []).map(
        (t) =>
          pdf('fluid.tool', { name: t.name }) +
          (t.serial ? pdf('fluid.serial', { serial: t.serial }) : '') +
          (t.calibrationDueOn
            ? pdf('fluid.calibrationDue', { day: formatDay(t.calibrationDueOn, language) })
            : ''),
      ),
    ]);
  }
}

async function drawPhotos(
  doc: RecordDocument,
  v: SignedCheckView,
  photoBytes: PhotoBytes,
  { pdf }: PrintWords,
) {
  if (v.photos.length === 0) return;
  doc.section(pdf('photos.title'));
  for (const p of v.photos) {
    const caption = pdf('photos.caption', { label: p.label, hash: p.sha256 });
    const printable = p.mimeType === 'image/jpeg' || p.mimeType === 'image/png';
    const bytes = p.storedName && printable ? await photoBytes(p.storedName) : null;
    if (bytes) doc.thumbnail(bytes, caption);
    else doc.item(caption, [p.storedName ? pdf('photos.webp') : pdf('photos.missing')]);
  }
}

/** The whole signed check: aircraft, readings, fluid, photos, note and signature, all as signed. */
export async function drawSignedCheck(
  doc: RecordDocument,
  v: SignedCheckView,
  photoBytes: PhotoBytes,
  words: PrintWords = englishPrint(),
) {
  const { pdf, language } = words;
  drawAirframe(doc, v, words);
  doc.section(pdf('check.title')).facts([
    [pdf('check.kind'), v.kindWords],
    [pdf('check.verdict'), v.verdictWords],
    [pdf('check.signed'), formatInstant(v.signedAt, 'UTC', language)],
  ]);
  drawReadings(doc, v, words);
  drawServicing(doc, v, words);
  if (v.note) doc.section(pdf('check.note')).paragraph(v.note);
  await drawPhotos(doc, v, photoBytes, words);
  doc.section(pdf('check.signature'));
  doc.item(v.signer.name, signatureLines(v.signer, v.signedAt, v.contentHash, null, words));
}
