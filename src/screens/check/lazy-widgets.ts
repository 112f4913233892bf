// The preview and the rate map load after the first paint (src/ui/lazyModule.ts).
import { lazyModule } from '../../ui/lazyModule';

export const widgets = lazyModule(() => import('./widgets'));
