import type { ComponentChildren } from 'preact';
import { currentScreen } from '../state/navigation';
import { offeredShare, sessionMessage, storageOpened } from '../state/sessionNotices';
import { storageMessage, storageStatus } from '../state/store/status';
import { Banner } from './banner';
import { AppFrame } from './frame';
import { screenEntry, toolScreens, type ScreenEntry } from './screen-list';
import './theme/global.css';
import './theme/print.css';

interface Props {
  /** The service-worker notice (main.tsx passes it; tests leave it out). */
  updateNotice?: ComponentChildren;
}

/** Opens the offered machine (the session's code is loaded by then: it made the offer). */
function acceptOfferedShare(): void {
  import('../state/session')
    .then((session) => session.acceptOfferedShare())
    .catch(() => {
      sessionMessage.value = {
        kind: 'problem',
        text: 'The shared machine could not be opened: reload the page, then open the link again.',
      };
    });
}

/** Page layout and navigation: the frame, the notices, and the screen the tab bar chose. */
export function App({ updateNotice }: Props) {
  const session = sessionMessage.value;
  const status = storageStatus.value;
  const problem = storageMessage.value;
  const offer = offeredShare.value;
  const entry = screenEntry(currentScreen.value);
  const notices = (
    <>
      {session && (
        <Banner
          kind={session.kind}
          onClose={() => (sessionMessage.value = null)}
          testId="session-message"
        >
          {session.text}
        </Banner>
      )}
      {offer && (
        <Banner kind="info" onClose={() => (offeredShare.value = null)} testId="share-offer">
          A share link for {offer.name.trim() ? `"${offer.name.trim()}"` : 'a machine'} was opened.
          Open it in place of what is on screen?{' '}
          <button type="button" onClick={acceptOfferedShare}>
            Open the shared machine
          </button>
        </Banner>
      )}
      {storageOpened.value && status.mode !== 'saved' && (
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
  return (
    <>
      <AppFrame notices={notices} current={entry.id}>
        <Screen key={entry.id} entry={entry} />
      </AppFrame>
      {/* It floats at the foot of the window (it comes late and must not push the page). */}
      {updateNotice}
    </>
  );
}

/** The open screen: at once from the first chunk, or once the tools chunk has loaded. */
function Screen({ entry }: { entry: ScreenEntry }) {
  if ('now' in entry.screen) {
    const Now = entry.screen.now;
    return <Now />;
  }
  return <LaterScreen pick={entry.screen.later} />;
}

function LaterScreen({
  pick,
}: {
  pick: Extract<ScreenEntry['screen'], { later: unknown }>['later'];
}) {
  const { module: tools, failed } = toolScreens.use();
  if (failed) {
    return (
      <p role="alert" data-testid="screen-load-failed">
        This tool could not be loaded. Open Trueturn once with a connection, then try again.
      </p>
    );
  }
  if (!tools) return <p aria-busy="true">Opening…</p>;
  const Later = pick(tools);
  return <Later />;
}
