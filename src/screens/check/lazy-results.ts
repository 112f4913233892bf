// The lists under the check screen's answer and its report load after the first paint
// (src/ui/lazyModule.ts): the answer paints first, and the lists follow.
import { lazyModule } from '../../ui/lazyModule';

export const results = lazyModule(() => import('./results'));
