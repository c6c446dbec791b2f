import { HangarBoard } from '../../features/board/components/hangar-board';

export function BoardRoute() {
  return <HangarBoard signInHref="/desk" />;
}
