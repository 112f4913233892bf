// The preview and the rate map load after the first paint (src/lib/lazyModule.ts).
import { lazyModule } from '../../lib/lazyModule';

export const widgets = lazyModule(() => import('./widgets'));
