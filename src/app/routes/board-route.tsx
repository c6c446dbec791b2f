import { useSearchParams } from 'react-router-dom';
import { boardBases, boardParams } from '@shared/schemas/board-address';
import { HangarBoard } from '@/features/board/components/hangar-board';

// Where the board's sign-in link goes; not words.
const deskSignInPath = '/desk';

export function BoardRoute() {
  const [params] = useSearchParams();
  return (
    <HangarBoard
      signInHref={deskSignInPath}
      boardToken={params.get(boardParams.token)}
      bases={boardBases(params.get(boardParams.bases))}
    />
  );
}
