import { render } from 'preact';
import { App } from './app';
import { startSession } from './state/setup';
import { ServiceWorkerNotice } from './views/UpdateNotice/connected';

render(<App updateNotice={<ServiceWorkerNotice />} />, document.getElementById('app')!);
void startSession();
