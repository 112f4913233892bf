import { useRegisterSW } from 'virtual:pwa-register/preact';
import { UpdateNotice } from '.';
import { keepCheckingForUpdates } from './update-checks';

interface Props {}

/**
 * Registers the generated service worker (vite-plugin-pwa, registerType 'prompt'), keeps
 * asking it for updates while the app is open, and shows its news. Kept apart from
 * UpdateNotice so the notice can be tested without a worker.
 */
export function ServiceWorkerNotice(_props: Props) {
  const {
    needRefresh: [updateReady, setUpdateReady],
    offlineReady: [offlineReady, setOfflineReady],
    updateServiceWorker,
  } = useRegisterSW({
    // A tab left open still learns of a new version (see update-checks.ts).
    onRegisteredSW: (_url, registration) => {
      if (registration) keepCheckingForUpdates(registration);
    },
  });
  return (
    <UpdateNotice
      updateReady={updateReady}
      offlineReady={offlineReady}
      onUpdate={() => void updateServiceWorker(true)}
      onDismiss={() => {
        setUpdateReady(false);
        setOfflineReady(false);
      }}
    />
  );
}
