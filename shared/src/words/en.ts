/**
 * Every validation message the product shows, in English, in one place. The shared zod schemas
 * take their words from here, so the API's 400 answers and the forms under a field read the same,
 * and a person never meets a developer's field name ("workedOn"), a code list in snake_case or a
 * path such as "pedals[3].currentMa". Another language is another file of the same shape.
 *
 * Who reads what: players read the configurator, sign-in, sign-up, request and build-page words;
 * staff read the backoffice words. Both are plain; staff words may use the trade's terms.
 */

/** Plain names of the fields the schemas check, keyed by the field's name in the API. */
export const fieldLabels: Readonly<Record<string, string>> = {
  accept: 'Your answer',
  active: 'Active',
  amount: 'Amount',
  approve: 'The answer',
  benchDate: 'Bench date',
  body: 'Message',
  bookingId: 'Booking',
  builderId: 'Builder',
  caption: 'Caption',
  carrier: 'Carrier',
  cause: 'Who asked to cancel',
  comment: 'Comment',
  condition: 'Condition',
  confirmPossibleDuplicate: 'Confirm a second copy',
  contactEmail: 'The shop’s e-mail',
  countryCode: 'Country',
  daysBefore: 'Days before the ship-by day',
  daysAfterReady: 'Days after the board is ready',
  daysUnpaid: 'Days a request waits for its deposit',
  enabled: 'Reminder on',
  hoursAfter: 'Hours after the checkout was opened',
  deposit: 'Deposit status',
  description: 'Description',
  email: 'E-mail',
  endsOn: 'Last day',
  from: 'First day shown',
  givenBy: 'Who gave the answer',
  hourlyRate: 'Hourly rate',
  hours: 'Hours',
  item: 'Item',
  items: 'Items',
  kind: 'Kind of photo',
  level: 'Level',
  locale: 'Locale',
  shopWorks: 'Whether the shop works that day',
  levelOverrideReason: 'Reason for a builder below the rig’s level',
  message: 'Message',
  method: 'How it was paid',
  name: 'Name',
  note: 'Note',
  notes: 'Notes',
  order: 'Order',
  page: 'Page',
  pageSize: 'Rows per page',
  password: 'Password',
  q: 'Search',
  reason: 'Reason',
  reprice: 'Re-price',
  search: 'Search',
  sort: 'Sort',
  startsOn: 'First day',
  state: 'Status',
  tagline: 'Tagline',
  tellPlayer: 'Tell the player',
  timezone: 'Time zone',
  to: 'New status',
  tracking: 'Tracking number',
  via: 'How the answer came',
  weeklyHours: 'Weekly hours',
  workedOn: 'Day worked',
};

/** ISO 8601 weekday numbers as the team form names them. */
export const weekdayNames: Readonly<Record<string, string>> = {
  '1': 'Monday',
  '2': 'Tuesday',
  '3': 'Wednesday',
  '4': 'Thursday',
  '5': 'Friday',
  '6': 'Saturday',
  '7': 'Sunday',
};

/** "pedalCount" → "Pedal count": the fallback for a field with no label above. */
export function humanizeField(field: string): string {
  const spaced = field
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_.-]+/g, ' ')
    .trim()
    .toLowerCase();
  return spaced.charAt(0).toUpperCase() + spaced.slice(1);
}

/** The plain name of a field: its label, or the words given (a helper may be handed words directly). */
export function label(field: string): string {
  return fieldLabels[field] ?? (/\s/.test(field) ? field : humanizeField(field));
}

/** "in_person" → "in person": enum values read as words in a message. */
export const valueWords = (value: string) => value.replace(/_/g, ' ');

/** "a, b or c". */
export function orList(values: readonly string[]): string {
  if (values.length <= 1) return values.join('');
  return `${values.slice(0, -1).join(', ')} or ${values[values.length - 1]}`;
}

/** The sentences the schema helpers build around a field's label. */
export const rules = {
  text: (l: string) => `${l} must be written as text`,
  required: (l: string) => `${l} is required`,
  tooLong: (l: string, max: number) => `${l} can be at most ${max} characters long`,
  tooShort: (l: string, min: number) => `${l} needs at least ${min} characters`,
  day: (l: string) => `${l} must be a real calendar day, like 2026-12-14`,
  dayOrder: (later: string, earlier: string) => `${later} must be on or after the ${earlier.toLowerCase()}`,
  id: (what: string) => `Choose ${what} from the list; this one is not known here`,
  amount: (l: string, example: string) => `${l} must be an amount above 0, like ${example}`,
  yesNo: (l: string) => `${l} must be yes or no (true or false)`,
  /** The values are the API's own codes, quoted as they must be sent (forms offer them as choices). */
  oneOf: (l: string, values: readonly string[]) => `${l} must be one of: ${orList(values.map((v) => `"${v}"`))}`,
  hours: (l: string) => `${l} must be a number of hours, like 1.5`,
  hoursDecimals: (l: string) => `${l} takes at most two decimals, like 1.25`,
  number: (l: string) => `${l} must be a number, like 1.5`,
  numberFromTo: (l: string, min: number, max: number, unit = '', whole = false) =>
    `${l} must be ${whole ? 'a whole number' : 'a number'} from ${min} to ${max}${unit ? ` ${unit}` : ''}`,
  wholeNumber: (l: string) => `${l} must be a whole number`,
  atLeast: (l: string, min: number) => `${l} must be ${min} or more`,
  atMost: (l: string, max: number) => `${l} can be at most ${max}`,
  list: (l: string) => `${l} must be a list`,
  unknownFields: (keys: readonly string[]) =>
    `${keys.map((k) => `"${k}"`).join(', ')} ${keys.length === 1 ? 'is not a field' : 'are not fields'} this request takes; remove ${keys.length === 1 ? 'it' : 'them'}`,
  notAnObject: 'The request must be a JSON object of named fields, like {"name": "value"}',
  atLeastOneOf: (labels: readonly string[]) => `Say what to change: ${orList(labels.map((l) => l.toLowerCase()))}`,
  /** A value zod refused without a message of our own (the fallback of the error map). */
  invalid: (l: string) => `${l} is not a value this form takes; check it and try again`,
  invalidRequest: 'Part of the request could not be read; check the values and try again',
} as const;

/** Accounts: sign-in, sign-up, password links, invitations. Players and staff read these. */
export const authWords = {
  email: 'Enter an e-mail address, like name@example.com',
  passwordEmpty: 'Enter your password',
  passwordShort: (min: number) => `Choose a password of at least ${min} characters`,
  passwordLong: (max: number) => `A password can be at most ${max} characters long`,
  passwordsDiffer: 'The two passwords do not match; type the same password twice',
  passwordUnchanged: 'Choose a new password that differs from your current one',
  currentPasswordWrong:
    'That is not your current password. Type it again, or sign out and choose a new one with "Forgot your password?" on the sign-in page',
  nameEmpty: 'Enter a name',
  nameLong: 'A name can be at most 120 characters long',
  token: 'This link is incomplete; open the link from the e-mail again',
  level: 'Choose a level: apprentice, journeyman or master',
  hourlyRate: 'Hourly rate must be an amount above 0 with at most two decimals, like 85.00',
} as const;

/** The rig configuration: what the configurator and POST /api/estimates say (players read these). */
export const rigWords = {
  /** A labor line's explanation: what the hours count, then the rate ("… , at $100.00–$150.00 per hour"). */
  laborAt: (basis: string, rate: string) => `${basis}, at ${rate} per hour`,
  pedalName: 'Pedal name',
  pedalKind: (kinds: readonly string[]) => `Pedal type must be one of: ${orList(kinds.map(valueWords))}`,
  powered: 'Powered',
  inLoop: 'In a switcher loop',
  currentDraw: 'Current draw',
  voltage: 'Voltage',
  polarity: 'Polarity must be center negative or center positive',
  supply: 'Supply must be DC or AC',
  width: 'Width',
  depth: 'Depth',
  digital: 'Digital',
  powerOutput: 'Supply output',
  pedalNotAnObject: 'Each pedal needs at least a name',
  switcherName: 'Switcher name',
  switcherCurrentDraw: 'Switcher current draw',
  switcherVoltage: 'Switcher voltage',
  switcherSupply: 'Switcher supply must be DC or AC',
  switcherWidth: 'Switcher width',
  switcherDepth: 'Switcher depth',
  switcherPowerOutput: 'Switcher’s supply output',
  switcherNotAnObject: 'The switcher must be described by its figures, such as its current draw',
  outputLabel: 'Output label',
  outputVoltage: 'Output voltage',
  outputCurrent: 'Output current rating',
  isolated: 'Isolated',
  outputSupply: 'Output supply must be DC or AC',
  outputPolarity: 'Output polarity must be center negative or center positive',
  outputNotAnObject: 'Each supply output needs its voltage, current rating and whether it is isolated',
  surface: 'Surface',
  case: 'Case',
  routingMode: 'Routing must be a plain series or a loop switcher',
  routingNotAnObject: 'Choose how the pedals are routed: in series or through a loop switcher',
  pedalsList: 'Pedals must be a list',
  atLeastOnePedal: 'List at least one pedal',
  tooManyPedals: (max: number) => `A board takes at most ${max} pedals here; ask the shop about anything larger`,
  pedalCount: 'Pedal count',
  pedalCountRange: (max: number) => `Pedal count must be a whole number from 1 to ${max}`,
  extra: 'Extra',
  extrasList: 'Extras must be a list of the shop’s extras',
  tooManyExtras: (max: number) => `Choose at most ${max} extras`,
  builderLevel: 'Choose a builder level: apprentice, journeyman or master',
  outputsList: 'Supply outputs must be a list',
  tooManyOutputs: (max: number) => `A supply lists at most ${max} outputs`,
  powerSupplyNotAnObject: 'The power supply must list its outputs',
  configurationNotAnObject: 'The configuration could not be read; start again from the configurator',
  pedalsOrCount: 'List the pedals, or give a pedal count',
  notBoth: 'Give either the pedal list or a pedal count, not both',
  switcherNeedsList: 'A switcher board needs the pedal list, to know which pedals go in loops',
  extraTwice: (code: string) => `The extra "${code}" is chosen twice`,
  serialHasNoSwitcher: 'A board in series has no switcher; choose switcher routing or leave the switcher out',
  noSuchOutput: (output: number, outputs: number) =>
    outputs === 0
      ? `Supply output ${output + 1} does not exist: the supply has no outputs listed yet`
      : `Supply output ${output + 1} does not exist: the supply lists ${outputs} output${outputs === 1 ? '' : 's'}`,
  bothOrNeither: 'Give both width and depth, or neither',
  loopOnSerial: (pedal: string) => `${pedal} is in a loop, but a board in series has no switcher loops`,
  switcherNeedsRouting: 'A loop switcher needs switcher routing',
  switcherInOwnLoop: 'The switcher cannot sit in its own loop',
  oneSwitcher: 'One loop switcher per board',
  listOrCount: 'List at least one pedal, or switch to a quick count',
  unknownCurrency: (code: string) =>
    `The price book's currency "${code}" is not a known currency code; the owner can correct it on the Price book page`,
  unknownSurface: (id: string) => `The surface "${id}" is not one the shop offers now; choose a surface on the Surface step`,
  unknownCase: (id: string) => `The case "${id}" is not one the shop offers now; choose a case on the Case step`,
  caseDoesNotFit: (kase: string, surface: string) => `The ${kase} does not fit the ${surface}; choose another case or surface`,
  unknownExtra: (code: string) => `The extra "${code}" is not one the shop offers now; choose extras on the Extras step`,
  noRates: (level: string) => `The shop has no rates for the ${level} level yet; choose another builder level`,
  /** Where in the rig a problem is: "Pedal 4", "Supply output 2". */
  wherePedal: (index: number) => `Pedal ${index + 1}`,
  whereOutput: (index: number) => `Supply output ${index + 1}`,
  whereExtra: (index: number) => `Extra ${index + 1}`,
  whereSwitcher: 'Switcher',
} as const;

/** The shop's own forms (backoffice: staff read these). */
export const shopWords = {
  shopNameShort: 'The shop’s name needs at least 2 characters',
  contactEmail: 'Enter the shop’s e-mail address, like shop@example.com',
  countryCode: 'Country must be a country from the list (its two-letter code, like US)',
  timezone: 'Time zone must be a place name from the time zone list, like America/Chicago',
  holidayChoice: 'Say whether the shop works that day: true to open the bench, false to keep it closed',
  notAHoliday: (day: string, country: string) =>
    `${day} is not a public holiday in ${country}; only the country’s public holidays can be switched off or on`,
  settingsEmpty: 'Say what to change: the name, tagline, e-mail, country, time zone, locale or postal address',
  locale: 'Locale must be a language and region, like en-US or de-DE',
  closureReason: 'Reason must say why the shop is closed',
  closureTooLong: (days: number) => `A closure can last at most ${days} days; add another for longer`,
  leadTimeHours: 'Hours must be the estimate’s labor hours, a number above 0 and below 1000, like 13.00',
  teamEmpty: 'Say what to change: the level, hourly rate, weekly hours or whether the builder is active',
  dayHours: (day: string) => `${day} must be a number of hours from 0 to 24`,
  unknownWeekdays: (keys: readonly string[]) =>
    `${keys.map((k) => `"${k}"`).join(', ')} ${keys.length === 1 ? 'is not a day' : 'are not days'}; days are numbered 1 (Monday) to 7 (Sunday)`,
  weeklyHoursNotAnObject: 'Weekly hours must give hours per weekday, like {"1": 7, "2": 7}',
} as const;

/** A booking's change of plan, intake, hours, extras, notes, payments (mostly staff; some players). */
export const bookingWords = {
  listCursor: 'That page link is damaged or out of date; start again from the first page',
  listCursorOtherOrder: 'That page link belongs to another order of the list; start again from the first page',
  moveReason: 'Reason is required: say why the build moves (the player reads it)',
  cancelReason: 'Reason is required: say why the build is cancelled (the player reads it)',
  absenceReason: 'Reason is required: say why (only the shop sees it)',
  levelOverrideReason: 'Say why a builder below the rig’s level takes this build',
  cancelCause: 'Say who asked to cancel: the player, or the shop (it cannot build it)',
  priceConsent: 'Answer yes to keep the build at the new price, or no to cancel with a full refund',
  carrier: 'Say who carries the parcel',
  tracking: 'Give the parcel’s tracking number',
  releaseNote: 'Note must say why the build may be delivered despite the dispute',
  refundReason: 'Reason must say why the deposit is refunded',
  declineReason: 'Reason must say why, in at least a few words',
  tellPlayerNeedsNote: 'Write the words the player should read, or leave “tell the player” off',
  reasonRequired: 'Reason is required: say why',
  waiveReason: 'Reason must say why the balance is waived',
  hoursAboveZero: 'Hours must be more than 0',
  hoursAtMost24: 'Hours can be at most 24 for one day',
  timeEntryEmpty: 'Say what to change: the day worked, the hours or the note',
  intakeItem: 'Item must name the pedal or part',
  faultyNeedsNote: 'Note must say what is wrong with a faulty item',
  itemsList: 'Items must be a list',
  itemsAtLeastOne: 'List at least one pedal or part',
  itemsAtMost: (max: number) => `List at most ${max} pedals or parts`,
  extraDescription: 'Description must say what the extra is',
  extraReason: 'Reason must say why the extra is needed',
  givenBy: 'Say who gave the answer',
  staffNote: 'Note is required: write the words to keep',
} as const;

/** The conversation on a build: what the player and the shop read beside the thread and in its mail. */
export const messageWords = {
  emptyMessage: 'Write a message or attach a photo before sending',
  tooManyPhotos: (max: number) => `Attach at most ${max} photos to one message`,
  notYours: (id: string) => `There is no build ${id} whose messages you can read`,
  /** The badge beside a build in a list, and beside Builds in the backoffice's navigation. */
  unreadBadge: (count: number) => (count === 1 ? '1 unread message' : `${count} unread messages`),
  /** The shop's build page when the reader is a builder not assigned to the build. */
  notYourThread: 'Only the owner and the builder assigned to this build talk with the player here.',
  /** Subject of the mail that tells one side of new messages from the other. */
  toPlayerSubject: (reference: string, count: number) =>
    `${count === 1 ? 'A new message' : `${count} new messages`} about build ${reference}`,
  toShopSubject: (reference: string, player: string, count: number) =>
    `${player} wrote ${count === 1 ? 'a message' : `${count} messages`} about build ${reference}`,
  toPlayerHeading: 'Your builder wrote to you',
  toShopHeading: 'The player wrote to the shop',
  photoCount: (n: number) => (n === 1 ? '1 photo attached' : `${n} photos attached`),
  answerInApp: 'Answer on the build page; replies by e-mail do not reach the thread.',
  openThread: 'Open the conversation',
} as const;

/**
 * Reminders and request expiry (settings: staff read these; mail subjects and history lines:
 * players and staff). Days are written by the caller through the shop's formatter.
 */
export const reminderWords = {
  settingsEmpty: 'Say what to change: the ship-by, balance, checkout or request-expiry reminder',
  groupEmpty: (what: string) => `Say what to change for the ${what}: whether it is on, or when it goes out`,
  actor: 'Loomwright reminders',
  kinds: {
    shipBy: 'ship-by reminder',
    balanceUnpaid: 'balance reminder',
    checkoutAbandoned: 'unfinished-checkout reminder',
    requestExpiry: 'request expiry',
  },
  shipByPlayerNote: (shipBy: string, to: string) =>
    `Reminder sent to ${to}: the pedals are due by ${shipBy} and no tracking number is recorded yet.`,
  shipByShopNote: (shipBy: string, to: string) =>
    `Reminder sent to ${to} (shop): ship-by day ${shipBy} is near and the parcel has no tracking number.`,
  balanceNote: (amount: string, days: number) =>
    `Reminder sent to the player: a balance of ${amount} is still unpaid ${days} ${days === 1 ? 'day' : 'days'} after the board was ready.`,
  checkoutNote: (what: string, hours: number) =>
    `Reminder sent to the player: the ${what} checkout opened more than ${hours} hours ago was not finished.`,
  expiredNote: (days: number) =>
    `Request expired: the deposit was not paid within ${days} ${days === 1 ? 'day' : 'days'} of the request. Nothing was held on the bench.`,
} as const;

/** Answers about the request itself: an address or a body the API cannot read. */
export const requestWords = {
  /** An id in the address that cannot be one (only a hand-edited link gets here). */
  notAnId: (what: string) => `This address does not name ${what}; open it again from its list`,
  bodyNotAnObject: 'The request body must be a JSON object of named fields, like {"name": "value"}, not a single value',
  notAPhoto: (found?: string) =>
    `That file is ${found ? `a ${found} file, not a photo` : 'not a photo this page can read'}; upload a JPEG, PNG or WebP photo`,
} as const;

/** Words about checks a player reads on the estimate (as opposed to the build sheet staff read). */
export const checkWords = {
  /** Said beside a figure the shop filled in for a missing one. */
  typicalFigure: 'a typical figure',
} as const;

/** A builder's today (staff): what each build waits for and what to do next; hours and days come formatted. */
export const todayWords = {
  noTracking: 'The player has not given the parcel’s tracking number yet',
  parcelOnItsWay: (carrier: string | null, tracking: string) =>
    `Parcel on its way${carrier ? ` with ${carrier}` : ''} (tracking ${tracking}); check the pedals in when it arrives`,
  layoutApproval: 'The player’s approval of the layout',
  extraApproval: (count: number) => `The player’s answer on ${count === 1 ? 'an extra' : `${count} extras`}`,
  balance: (amount: string) => `The balance of ${amount}`,
  hoursToRecord: (planned: string, recorded: string) => `Hours for today: ${planned} planned, ${recorded} recorded`,
  askForTracking: 'Ask the player for the parcel’s tracking number',
  checkIn: 'Check the parcel in: record every pedal as working or faulty',
  waitForApproval: 'Wait for the player’s answer; work on what it does not touch',
  startBuild: 'Start the build: mount, wire and label',
  keepBuilding: 'Keep building; record the hours you spend',
  test: 'Test every path, preset and the power, then mark it ready',
  waitForBalance: 'Wait for the balance, or record it taken in person',
  handOver: 'Ship it or hand it over, then mark it delivered',
  ownerOnlyAll: 'Only the owner sees every builder’s builds; your today shows your own',
  noBench: 'Your account has no bench of its own on the team, so it has no builds to list',
} as const;

export const en = {
  fieldLabels,
  weekdayNames,
  rules,
  authWords,
  rigWords,
  shopWords,
  bookingWords,
  messageWords,
  requestWords,
  checkWords,
  todayWords,
  reminderWords,
  label,
  humanizeField,
  orList,
  valueWords,
};
export type Words = typeof en;
