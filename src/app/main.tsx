import { render } from 'preact';
import { startSession } from '../state/session';
import { App } from './app';
import { toolScreens } from './screen-list';
import { ServiceWorkerNotice } from './update-notice/connected';

render(<App updateNotice={<ServiceWorkerNotice />} />, document.getElementById('app')!);
void startSession();
// Fetch the field tools once the first screen is up, so their tabs open at once (and a failed
// fetch is simply tried again when a tab asks).
setTimeout(() => void toolScreens.load().catch(() => undefined), 0);
