import type { PriceBook } from './types';

/**
 * Version 1 of the invented demo shop's price book (Copperline Rig Works), from the defaults in
 * PRODUCT.md, which are common practice in the trade (no published source). Names are invented.
 */
export const demoPriceBook: PriceBook = {
  currency: 'USD',
  surfaces: [
    { id: 'slate-46', name: 'Slate 46 rail board', description: 'Prefab aluminium rails, room for 6 to 8 compact pedals.', widthMm: 460, depthMm: 310, price: '185.00', custom: false, layout: { rows: 2, tiered: false, switcherRow: 'front' } },
    { id: 'slate-61', name: 'Slate 61 rail board', description: 'Prefab aluminium rails, the usual size for 9 to 12 pedals.', widthMm: 610, depthMm: 320, price: '205.00', custom: false, layout: { rows: 2, tiered: false, switcherRow: 'front' } },
    { id: 'ridge-81', name: 'Ridge 81 tiered board', description: 'Prefab two-tier board, a switcher at the front and pedals behind.', widthMm: 810, depthMm: 410, price: '235.00', custom: false, layout: { rows: 2, tiered: true, switcherRow: 'front' } },
    { id: 'ridge-100', name: 'Ridge 100 tiered board', description: 'Prefab two-tier board for a full touring rig.', widthMm: 1000, depthMm: 460, price: '265.00', custom: false, layout: { rows: 3, tiered: true, switcherRow: 'front' } },
    { id: 'custom-ash', name: 'Made-to-measure ash surface', description: 'Hand-made hardwood surface cut to your layout, sealed and finished.', widthMm: 810, depthMm: 410, price: '520.00', custom: true, layout: { rows: 3, tiered: false, switcherRow: 'front' } },
  ],
  cases: [
    { id: 'shell-hard', name: 'Shell hard case', kind: 'hard_case', description: 'Moulded shell with foam lining and latches.', price: '255.00', notRecommended: false, caution: null, fitsSurfaceIds: [] },
    { id: 'tour-road', name: 'Tour road case', kind: 'road_case', description: 'Plywood road case with recessed hardware, built for flights and vans.', price: '315.00', notRecommended: false, caution: null, fitsSurfaceIds: [] },
    {
      id: 'gig-bag',
      name: 'Padded gig bag',
      kind: 'soft_bag',
      description: 'Light padded bag with a shoulder strap.',
      price: '95.00',
      notRecommended: true,
      caution: 'A soft bag is not recommended for a loaded board: it does not protect the pedals, jacks and switches from knocks in transit.',
      fitsSurfaceIds: [],
    },
  ],
  materials: {
    fastenersPerPedalSerial: '2.00',
    fastenersPerPedalSwitcher: '4.00',
    hookAndLoopFeetPerPedal: '1',
    hookAndLoopPricePerFoot: '5.00',
    cablePricePerFoot: '0.80',
    plugPrice: '4.00',
    patchLengthFeet: '1.5',
    spareFeetPerPatch: '0.5',
    barrelPlugPrice: '1.25',
  },
  labor: { hoursPerDeviceSerial: '1.00', hoursPerDeviceSwitcher: '1.50' },
  functions: [
    { id: 'fn-stereo', code: 'stereo_output', name: 'Stereo output', description: 'Left and right outputs from the last stereo pedal to two amps or channels.', laborHours: '1.00', functionCount: 1, extraPatchCables: 1, minimumLevel: 'journeyman' },
    { id: 'fn-four-cable', code: 'four_cable', name: 'Four-cable hookup', description: "Drives go in front of the amp, time effects through the amp's effects loop.", laborHours: '1.00', functionCount: 1, extraPatchCables: 2, minimumLevel: 'journeyman' },
    { id: 'fn-wdw', code: 'wet_dry_wet', name: 'Wet/dry/wet rig', description: 'A dry centre amp with wet effects on two side amps; counts as two functions.', laborHours: '2.00', functionCount: 2, extraPatchCables: 3, minimumLevel: 'master' },
    { id: 'fn-midi', code: 'midi_control', name: 'MIDI control', description: 'MIDI wiring from the switcher to pedals that take program changes.', laborHours: '1.00', functionCount: 1, extraPatchCables: 0, minimumLevel: 'journeyman' },
    { id: 'fn-expression', code: 'expression_jacks', name: 'Expression or auxiliary jacks', description: 'Panel jacks for an expression pedal or an auxiliary footswitch.', laborHours: '1.00', functionCount: 1, extraPatchCables: 1, minimumLevel: 'apprentice' },
    { id: 'fn-tuner-out', code: 'tuner_out', name: 'Dedicated tuner output', description: 'A separate feed to the tuner so it stays out of the signal path.', laborHours: '1.00', functionCount: 1, extraPatchCables: 1, minimumLevel: 'apprentice' },
    { id: 'fn-amp-switching', code: 'amp_switching', name: 'Amp channel switching', description: "Switcher control of the amp's channels and reverb through a TRS lead.", laborHours: '1.00', functionCount: 1, extraPatchCables: 1, minimumLevel: 'journeyman' },
    { id: 'fn-jack-panel', code: 'jack_panel', name: 'Input and output jack panel', description: 'A panel at the board edge for the guitar and amp cables.', laborHours: '1.00', functionCount: 1, extraPatchCables: 2, minimumLevel: 'apprentice' },
    { id: 'fn-amp-selector', code: 'amp_selector', name: 'Two-amp selector', description: 'Send the board to one amp, the other, or both.', laborHours: '1.00', functionCount: 1, extraPatchCables: 2, minimumLevel: 'journeyman' },
  ],
  levels: [
    { id: 'lvl-apprentice', code: 'apprentice', name: 'Apprentice', description: 'Plain serial boards under a senior builder’s eye.', rateLow: '40.00', rateHigh: '50.00' },
    { id: 'lvl-journeyman', code: 'journeyman', name: 'Journeyman', description: 'Serial and switcher boards, most functions.', rateLow: '80.00', rateHigh: '100.00' },
    { id: 'lvl-master', code: 'master', name: 'Master', description: 'Full switcher rigs, wet/dry/wet and anything unusual.', rateLow: '100.00', rateHigh: '150.00' },
  ],
  power: { maxDaisyChain: 3, highDrawMa: 100 },
  depositPolicy: {
    percent: '25',
    minimum: '100.00',
    description:
      'A deposit of 25% of the high end of the estimate (at least $100.00) holds your place in the queue. It is refundable until a bench date is set, and not refundable after that.',
  },
};
