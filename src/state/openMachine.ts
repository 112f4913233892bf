// The name of the saved machine the set-up was opened from, for report headers.
import { computed } from '@preact/signals';
import { machines } from './machines';
import { openMachineId } from './session';

/** Name of the open machine, or undefined when the set-up is not one of the saved machines. */
export const openMachineName = computed<string | undefined>(
  () => machines.value.find((m) => m.id === openMachineId.value)?.name,
);
