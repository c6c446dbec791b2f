import { phraseWords, type Phrase } from '@shared/i18n/phrase';

/** Reasons the server sent as phrases, one list item each, in the screen's language (the list is the caller's). */
export function ReasonItems({ reasons }: { reasons: readonly Phrase[] }) {
  return (
    <>
      {reasons.map((reason) => {
        const words = phraseWords(reason);
        return <li key={words}>{words}</li>;
      })}
    </>
  );
}
