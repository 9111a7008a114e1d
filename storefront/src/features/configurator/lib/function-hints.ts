/**
 * What each trade term means for the player, said once where the term first appears. Keyed by
 * the words a function's code usually holds, so a shop that adds its own functions still gets a
 * hint when the term matches.
 */
const hints: Array<[RegExp, string]> = [
  [
    /four[-_ ]?cable|4cm|4[-_]cable/i,
    'Four-cable: your drive pedals go before the amp’s preamp and your time effects (delay, reverb) into the amp’s effects loop, with four cables between board and amp.',
  ],
  [
    /wet[-_ ]?dry|wdw/i,
    'Wet/dry/wet: a dry amp in the middle and effected signal to one or two more amps either side. It counts as two functions of bench time.',
  ],
  [
    /stereo/i,
    'Stereo: the board ends in a left and a right output, for two amps or two inputs of a mixer, so stereo effects keep their width.',
  ],
  [/tuner|mute/i, 'A tuner output lets you tune silently while the rest of the board stays quiet.'],
  [/buffer/i, 'A buffer keeps your tone from dulling down long cable runs.'],
];

export function functionHint(code: string, name: string): string | undefined {
  return hints.find(([pattern]) => pattern.test(code) || pattern.test(name))?.[1];
}
