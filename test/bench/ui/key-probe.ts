// Runs inside the page (handed to page.evaluate, so it must not use anything from outside its
// own body). For each key that changes a field it records:
//  - keydownMs: the keydown event's timeStamp (when the browser received the key press, so
//    time spent waiting behind earlier work counts);
//  - rafMs: the first requestAnimationFrame callback asked for after the field's `input`
//    event has been handled (the app's handlers and the re-render they schedule as microtasks
//    run before a listener on document sees the bubbling event): "keydown → next frame", the
//    budgeted figure. Callbacks the app asked for earlier (its animation loop) run before it.
//  - frameDoneMs: a task posted from that callback, which runs once that frame's style, layout
//    and paint on the main thread are done: the rendering the rAF figure leaves out.
// Event Timing entries (keydown; 8 ms steps, only those of 16 ms or more) and long tasks
// (50 ms or more) are collected beside them.

export interface KeySample {
  key: string;
  keydownMs: number;
  rafMs: number;
  frameDoneMs: number;
}

export interface ProbeRecords {
  samples: KeySample[];
  /** Event Timing keydown entries: start (= the keydown's timeStamp) and duration. */
  eventTimings: Array<{ startMs: number; durationMs: number }>;
  /** Long tasks: start (page clock) and duration. */
  longTasks: Array<{ startMs: number; durationMs: number }>;
}

export interface KeyProbe {
  /**
   * Resolves once `count` keys have been measured and at least `gapMs` has passed since the
   * last one was pressed (a person's typing pace); rejects after `timeoutMs`.
   */
  waitFor(count: number, gapMs: number, timeoutMs: number): Promise<void>;
  /** Resolves after the next frame and at least `gapMs` from now: the pace of a step that is no key. */
  pause(gapMs: number): Promise<void>;
  /** Stops observing (after two more frames, so late Event Timing entries come in) and hands back what was seen. */
  finish(): Promise<ProbeRecords>;
}

declare global {
  interface Window {
    __trueturnKeyProbe?: KeyProbe;
  }
}

export function installKeyProbe(): void {
  const samples: KeySample[] = [];
  const eventTimings: ProbeRecords['eventTimings'] = [];
  const longTasks: ProbeRecords['longTasks'] = [];
  let pending: { key: string; keydownMs: number } | null = null;
  let changed: () => void = () => undefined;

  const onKeydown = (e: KeyboardEvent) => {
    pending = { key: e.key, keydownMs: e.timeStamp };
  };
  const onInput = () => {
    const key = pending;
    pending = null;
    if (!key) return;
    requestAnimationFrame(() => {
      const rafMs = performance.now();
      const channel = new MessageChannel();
      channel.port1.onmessage = () => {
        samples.push({ ...key, rafMs, frameDoneMs: performance.now() });
        channel.port1.close();
        changed();
      };
      channel.port2.postMessage(null);
    });
  };
  window.addEventListener('keydown', onKeydown, true);
  document.addEventListener('input', onInput);

  const keepEvents = (entries: PerformanceEntryList) => {
    for (const e of entries) {
      if (e.name === 'keydown') eventTimings.push({ startMs: e.startTime, durationMs: e.duration });
    }
  };
  const events = new PerformanceObserver((list) => keepEvents(list.getEntries()));
  events.observe({ type: 'event', durationThreshold: 16 } as PerformanceObserverInit);
  const longTaskObserver = new PerformanceObserver((list) => {
    for (const e of list.getEntries())
      longTasks.push({ startMs: e.startTime, durationMs: e.duration });
  });
  longTaskObserver.observe({ type: 'longtask' });

  const nextFrame = () => new Promise<void>((r) => requestAnimationFrame(() => r()));

  window.__trueturnKeyProbe = {
    waitFor(count, gapMs, timeoutMs) {
      return new Promise<void>((done, fail) => {
        const giveUp = setTimeout(() => {
          changed = () => undefined;
          fail(
            new Error(
              `key ${count} gave no input event and frame within ${timeoutMs} ms (${samples.length} measured)`,
            ),
          );
        }, timeoutMs);
        const check = () => {
          if (samples.length < count) return;
          changed = () => undefined;
          clearTimeout(giveUp);
          const wait = samples[count - 1].keydownMs + gapMs - performance.now();
          if (wait > 0) setTimeout(done, wait);
          else done();
        };
        changed = check;
        check();
      });
    },
    async pause(gapMs) {
      const from = performance.now();
      await nextFrame();
      const wait = from + gapMs - performance.now();
      if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    },
    async finish() {
      await nextFrame();
      await nextFrame();
      keepEvents(events.takeRecords());
      events.disconnect();
      for (const e of longTaskObserver.takeRecords()) {
        longTasks.push({ startMs: e.startTime, durationMs: e.duration });
      }
      longTaskObserver.disconnect();
      window.removeEventListener('keydown', onKeydown, true);
      document.removeEventListener('input', onInput);
      return { samples, eventTimings, longTasks };
    },
  };
}
