// The words for an entry are shared with the server's e-mails and exports.
export { describeEntry, positionLabels } from '@shared/domain/words';
