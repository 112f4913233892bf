// What the page says about the session, apart from the session's code (session.ts): the frame
// shows these notices from its first paint, while the code that opens storage and reads share
// links loads just after it.
import { signal } from '@preact/signals';
import type { MachineContent } from './model';

/** A message about how the session opened (a refused share link), for the top of the screen. */
export const sessionMessage = signal<{ kind: 'info' | 'problem'; text: string } | null>(null);

/** A shared machine opened while the app was open, offered before it replaces anything. */
export const offeredShare = signal<MachineContent | null>(null);

/** True once storage has been opened (or found unusable), so its status is worth showing. */
export const storageOpened = signal(false);
