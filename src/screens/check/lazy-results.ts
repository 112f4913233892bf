// The lists under the check screen's answer and its report load after the first paint
// (src/ui/lazyModule.ts): the answer paints first, and the lists follow. Once their code has
// come, they are worked out in a task of their own and drawn in the next, so neither task
// grows long on a slow phone.
import { lazyModule } from '../../ui/lazyModule';

const nextTask = () => new Promise<void>((go) => setTimeout(go, 0));

export const results = lazyModule(async () => {
  const module = await import('./results');
  await nextTask();
  module.workOutLists();
  await nextTask();
  return module;
});
