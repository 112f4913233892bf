import type { ComponentChildren } from 'preact';
import { currentScreen, type ScreenId } from '../state/navigation';
import { storageMessage, storageStatus } from '../state/storage';
import { sessionMessage, storageOpened } from '../state/setup';
import { AppFrame } from './frame';
import { Banner } from './banner';
import { CheckScreen } from '../screens/check';
import { MachinesScreen } from '../screens/machines';
import { lazyModule } from '../ui/lazyModule';
import './theme/global.css';
import './theme/print.css';

/**
 * The five field tools load after the first paint, keeping the first screen's JavaScript small;
 * the service worker precaches their chunk, so they open offline too. main.tsx asks for them
 * once the first screen is up, so a tap on their tab rarely waits.
 */
export const toolScreens = lazyModule(() => import('./tool-screens'));

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
        <Banner
          kind={session.kind}
          onClose={() => (sessionMessage.value = null)}
          testId="session-message"
        >
          {session.text}
        </Banner>
      )}
      {storageOpened.value && status.mode === 'memory' && (
        <Banner kind="problem" testId="storage-status">
          {status.reason ?? 'Saving is off: changes last only until this tab is closed.'}
        </Banner>
      )}
      {problem && (
        <Banner
          kind="problem"
          onClose={() => (storageMessage.value = null)}
          testId="storage-message"
        >
          {problem}
        </Banner>
      )}
    </>
  );
  return <AppFrame notices={notices}>{screenFor(currentScreen.value)}</AppFrame>;
}

/** The screen for a tab; the check screen is the home screen. */
function screenFor(id: ScreenId) {
  switch (id) {
    case 'machines':
      return <MachinesScreen />;
    case 'check':
      return <CheckScreen />;
    default:
      return <ToolScreen id={id} />;
  }
}

function ToolScreen({ id }: { id: Exclude<ScreenId, 'check' | 'machines'> }) {
  const { module: tools, failed } = toolScreens.use();
  if (failed) {
    return (
      <p role="alert" data-testid="screen-load-failed">
        This tool could not be loaded. Open Trueturn once with a connection, then try again.
      </p>
    );
  }
  if (!tools) return <p aria-busy="true">Opening…</p>;
  switch (id) {
    case 'lighting':
      return <tools.LightingScreen />;
    case 'camera-plan':
      return <tools.CameraPlanScreen />;
    case 'logger':
      return <tools.LoggerScreen />;
    case 'speed-finder':
      return <tools.SpeedFinderScreen />;
    case 'machine-chain':
      return <tools.MachineChainScreen />;
  }
}
