import { useSearchParams } from 'react-router-dom';
import { HangarBoard } from '@/features/board/components/hangar-board';

export function BoardRoute() {
  const [params] = useSearchParams();
  return <HangarBoard signInHref="/desk" boardToken={params.get('board')} />;
}
