import { useSearchParams } from 'react-router-dom';
import { HangarBoard } from '@/features/board/components/hangar-board';

// Where the board's sign-in link goes, and the query parameter that carries a TV's board link; neither is words.
const deskSignInPath = '/desk';
const boardTokenParam = 'board';
// `?base=NP,HH`: the board of those bases only.
const basesParam = 'base';

export function BoardRoute() {
  const [params] = useSearchParams();
  return (
    <HangarBoard
      signInHref={deskSignInPath}
      boardToken={params.get(boardTokenParam)}
      bases={params.get(basesParam)?.trim().toUpperCase() || null}
    />
  );
}
