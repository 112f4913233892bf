// The one list of screens: each screen's id, its tab label and icon, and how it is loaded.
// The tab bar, the app's choice of screen and the lazily loaded tools all read this list; a new
// screen is added here (DEVELOPERS.md, "Add a tool screen") and nowhere else.
import type { ComponentChildren } from 'preact';
import { CheckScreen } from '../screens/check';
import { CHECK_SCREEN } from '../state/navigation';
import { lazyModule } from '../ui/lazyModule';

/**
 * The Machines screen and the five field tools load on demand, keeping the first screen's
 * JavaScript small; the service worker precaches their chunk, so they open offline too. The tab
 * bar asks for them as soon as a finger or the keyboard reaches a tab, so a tap rarely waits.
 */
export const toolScreens = lazyModule(() => import('./tool-screens'));

/** A screen takes no props: each reads what it shows from the state signals. */
type Screen = (props: Record<string, never>) => ComponentChildren;
type Tools = Awaited<ReturnType<typeof toolScreens.load>>;

export interface ScreenEntry {
  id: string;
  /** The tab's words (also its accessible name). */
  label: string;
  /** The open screen's name: the page's one h1 and the window's title. */
  heading: string;
  /** The tab's drawing: SVG path data on a 24-unit square, stroked in the tab's own colour. */
  icon: string;
  /** The screen itself, in the first chunk (`now`), or taken from the tools chunk once loaded (`later`). */
  screen: { now: Screen } | { later: (tools: Tools) => Screen };
}

/** In tab order; the first is the home screen. Our own drawings, in strokes only. */
export const SCREENS = [
  {
    id: CHECK_SCREEN,
    label: 'Check',
    heading: 'Check what the viewer sees',
    // A part with a mark on it.
    icon: 'M21 12a9 9 0 1 1-18 0a9 9 0 1 1 18 0M12 12V5',
    screen: { now: CheckScreen },
  },
  {
    id: 'machines',
    label: 'Machines',
    heading: 'Saved machines',
    // A list of saved entries.
    icon: 'M4 6h16M4 12h16M4 18h10',
    screen: { later: (tools) => tools.MachinesScreen },
  },
  {
    id: 'lighting',
    label: 'Lighting',
    heading: 'Lighting check',
    // A lamp.
    icon: 'M9 18h6M10 21h4M12 3a6 6 0 0 0-4 10.5c.8.8 1 1.5 1 2.5h6c0-1 .2-1.7 1-2.5A6 6 0 0 0 12 3z',
    screen: { later: (tools) => tools.LightingScreen },
  },
  {
    id: 'camera',
    label: 'Camera',
    heading: 'Camera plan',
    // A camera body and its lens.
    icon: 'M3 8h4l2-2h6l2 2h4v11H3zM15.5 13a3.5 3.5 0 1 1-7 0a3.5 3.5 0 1 1 7 0',
    screen: { later: (tools) => tools.CameraScreen },
  },
  {
    id: 'logger',
    label: 'Logger',
    heading: 'Data logger plan',
    // A wave and the instants it is sampled at.
    icon: 'M3 12c2.5-6 5.5-6 9 0s6.5 6 9 0M6 17v3M12 17v3M18 17v3',
    screen: { later: (tools) => tools.LoggerScreen },
  },
  {
    id: 'speed-finder',
    label: 'Speed finder',
    heading: 'Speed finder',
    // A dial and its needle.
    icon: 'M4 17a8 8 0 1 1 16 0M12 17l4-5',
    screen: { later: (tools) => tools.SpeedFinderScreen },
  },
  {
    id: 'whole-machine',
    label: 'Whole machine',
    heading: 'Whole machine',
    // Two pulleys and their belt.
    icon: 'M10 15a3 3 0 1 1-6 0a3 3 0 1 1 6 0M20 8a4 4 0 1 1-8 0a4 4 0 1 1 8 0M5.5 12.4l9-7.6M8.6 17.3l10.3-6.3',
    screen: { later: (tools) => tools.WholeMachineScreen },
  },
] as const satisfies readonly ScreenEntry[];

/** The entry of a screen id; the home screen for an id the list does not hold. */
export function screenEntry(id: string): ScreenEntry {
  return SCREENS.find((s) => s.id === id) ?? SCREENS[0];
}
