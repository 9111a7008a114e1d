export const configuratorSteps = [
  { id: 'surface', title: 'Surface', hint: 'The board your pedals sit on' },
  { id: 'case', title: 'Case', hint: 'How the board travels' },
  { id: 'pedals', title: 'Pedals', hint: 'What goes on the board, and its power' },
  { id: 'routing', title: 'Routing', hint: 'Serial, or through a loop switcher' },
  { id: 'extras', title: 'Extras', hint: 'Stereo, four-cable and more' },
  { id: 'builder', title: 'Builder', hint: 'Who builds it, and at what rate' },
  { id: 'review', title: 'Review', hint: 'The estimate in full' },
] as const;

export type StepId = (typeof configuratorSteps)[number]['id'];

export const isStepId = (value: string | null): value is StepId => configuratorSteps.some((step) => step.id === value);
