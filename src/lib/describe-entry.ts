// The words live in shared/ so the server's printed records say an entry exactly as the screens do.
export { describeEntry, positionLabels } from '@shared/domain/entry-words';
