// The words for an entry are shared with the server's e-mails and exports.
export { describeEntry, describeReading, positionLabels } from '@shared/domain/words';
