import type { ComponentChildren } from 'preact';
import { currentScreen, type ScreenId } from './lib/navigation';
import { storageMessage, storageStatus } from './state/storage';
import { sessionMessage, storageOpened } from './state/setup';
import { AppFrame } from './views/AppFrame';
import { Banner } from './views/Banner';
import { CheckScreen } from './views/CheckScreen';
import { MachinesScreen } from './views/MachinesScreen';
import { LightingScreen } from './views/LightingScreen';
import { CameraPlanScreen } from './views/CameraPlanScreen';
import { LoggerScreen } from './views/LoggerScreen';
import { SpeedFinderScreen } from './views/SpeedFinderScreen';
import { MachineChainScreen } from './views/MachineChainScreen';
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
      {screenFor(currentScreen.value)}
    </AppFrame>
  );
}

/** The screen for a tab; the check screen is the home screen. */
function screenFor(id: ScreenId) {
  switch (id) {
    case 'machines':
      return <MachinesScreen />;
    case 'lighting':
      return <LightingScreen />;
    case 'camera-plan':
      return <CameraPlanScreen />;
    case 'logger':
      return <LoggerScreen />;
    case 'speed-finder':
      return <SpeedFinderScreen />;
    case 'machine-chain':
      return <MachineChainScreen />;
    default:
      return <CheckScreen />;
  }
}
