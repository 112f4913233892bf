import { useRegisterSW } from 'virtual:pwa-register/preact';
import { UpdateNotice } from '.';

interface Props {}

/**
 * Registers the generated service worker (vite-plugin-pwa, registerType 'prompt') and shows
 * its news. Kept apart from UpdateNotice so the notice can be tested without a worker.
 */
export function ServiceWorkerNotice(_props: Props) {
  const {
    needRefresh: [updateReady, setUpdateReady],
    offlineReady: [offlineReady, setOfflineReady],
    updateServiceWorker,
  } = useRegisterSW();
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
