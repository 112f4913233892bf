import type { ComponentChildren } from 'preact';
import { currentScreen } from './lib/navigation';
import { storageMessage, storageStatus } from './state/storage';
import { sessionMessage, storageOpened } from './state/setup';
import { AppFrame } from './views/AppFrame';
import { Banner } from './views/Banner';
import { CheckScreen } from './views/CheckScreen';
import { MachinesScreen } from './views/MachinesScreen';
import './views/Theme/global.css';
import './views/Theme/print.css';

interface Props {
  /** The service-worker notice (main.tsx passes it; tests leave it out). */
  updateNotice?: ComponentChildren;
}

/** Page layout and navigation: the frame, the notices, and the screen the tab bar chose. */
export function App({ updateNotice }: Props) {
  const session = sessionMessage.value;
  const status = storageStatus.value;
  const problem = storageMessage.value;
  const notices = (
    <>
      {updateNotice}
      {session && (
        <Banner kind={session.kind} onClose={() => (sessionMessage.value = null)} testId="session-message">
          {session.text}
        </Banner>
      )}
      {storageOpened.value && status.mode === 'memory' && (
        <Banner kind="problem" testId="storage-status">
          {status.reason ?? 'Saving is off: changes last only until this tab is closed.'}
        </Banner>
      )}
      {problem && (
        <Banner kind="problem" onClose={() => (storageMessage.value = null)} testId="storage-message">
          {problem}
        </Banner>
      )}
    </>
  );
  return (
    <AppFrame notices={notices}>
      {currentScreen.value === 'machines' ? <MachinesScreen /> : <CheckScreen />}
    </AppFrame>
  );
}
