// What a test can ask of Chromium's fake microphone (--use-file-for-fake-audio-capture).

/**
 * How near the speed heard through the fake microphone must come to the fan's, as a share of
 * it. The fake device plays its file by its own timer, not by the page's audio clock, and the
 * page's audio graph takes samples at its own rate: where the two disagree the capture loses or
 * repeats bits of the file, which shifts every frequency heard by the share lost. A 1750 rpm
 * fan has read 1750.00 rpm, and also 1753.7 rpm (a fresh-clone CI run) and 1753.85 rpm (a quiet
 * machine, the page's audio at 44.1 kHz against the file's 48 kHz): +0.22 %. A picked file is
 * decoded whole, so the tests that pick one keep the tight bar of 2 rpm.
 */
export const FAKE_MICROPHONE_SHARE = 0.005;
