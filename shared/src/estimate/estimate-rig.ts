import Decimal from 'decimal.js';
import { boardFitOf, TYPICAL_FOOTPRINTS_WARNING } from '../checks/board-fit';
import { cableScheduleOf } from '../checks/cable-schedule';
import { complexityOf } from '../checks/complexity';
import { powerBudgetOf } from '../checks/power-budget';
import { DEFAULT_POWER_RULES } from '../checks/power-plan';
import { signalChainOf } from '../checks/signal-chain';
import type { RigChecks, SignalChain } from '../checks/types';
import { levelRank } from '../domain';
import type { FunctionItem, PriceBook } from '../price-book/types';
import { rigWords as w } from '../words';
import { bookIndex, rateWordsOf, type BookIndex } from './book-index';
import { EstimateInputError } from './errors';
import { compare, exactOf, figure, plus, roundHalfUp, times, timesInt, toFixedText, ZERO, type Exact } from './exact';
import { minorUnitDigits, roundToMinorUnit } from './money';
import type { EstimateLine, EstimateResult, RigConfiguration } from './types';

/** Hours are written with two decimals (rounded half up). */
const hours = (h: Exact) => toFixedText(h, 2);

const count = (n: number) => String(n);

/** Looks every id of the configuration up in the book; a miss is the player's to fix, by field. */
function resolve(config: RigConfiguration, book: PriceBook, index: BookIndex) {
  if (minorUnitDigits(book.currency) === undefined) throw new EstimateInputError('currency', w.unknownCurrency(book.currency));
  const surface = index.surfaces.get(config.surfaceId);
  if (!surface) throw new EstimateInputError('surfaceId', w.unknownSurface(config.surfaceId));
  const rigCase = index.cases.get(config.caseId);
  if (!rigCase) throw new EstimateInputError('caseId', w.unknownCase(config.caseId));
  if (rigCase.fitsSurfaceIds.length > 0 && !rigCase.fitsSurfaceIds.includes(surface.id)) {
    throw new EstimateInputError('caseId', w.caseDoesNotFit(rigCase.name, surface.name));
  }
  const functions: FunctionItem[] = config.functions.map((code, i) => {
    const fn = index.functions.get(code);
    if (!fn) throw new EstimateInputError(`functions[${i}]`, w.unknownExtra(code));
    return fn;
  });
  const level = index.levels.get(config.level);
  if (!level) throw new EstimateInputError('level', w.noRates(config.level));
  return { surface, rigCase, functions, level };
}

interface LaborItem {
  code: string;
  label: string;
  hours: Exact;
  quantity: string;
  unit: string;
  explanation: string;
}

/**
 * Hours by the trade's rule: each device in the main chain (the switcher too) and the customer's
 * supply take the serial hours; each pedal wired through a switcher loop takes the loop hours,
 * since both of its ends are cabled; each function its own hours (wet/dry/wet counting as two).
 */
function laborItems(chain: SignalChain, functions: FunctionItem[], book: PriceBook): LaborItem[] {
  const serialHours = figure(book.labor.hoursPerDeviceSerial);
  const loopHours = figure(book.labor.hoursPerDeviceSwitcher);
  const mainDevices = chain.main.length;
  const loopDevices = chain.loops.length;
  const items: LaborItem[] = [
    {
      code: 'labor_devices',
      label:
        chain.routing === 'serial'
          ? 'Mount and wire each device in series'
          : 'Mount and wire each device outside the loops (the switcher too)',
      hours: timesInt(serialHours, mainDevices),
      quantity: count(mainDevices),
      unit: 'device',
      explanation: `${mainDevices} × ${hours(serialHours)} h`,
    },
  ];
  if (loopDevices > 0) {
    items.push({
      code: 'labor_loop_devices',
      label: 'Mount and wire each pedal through a switcher loop (send and return)',
      hours: timesInt(loopHours, loopDevices),
      quantity: count(loopDevices),
      unit: 'device',
      explanation: `${loopDevices} × ${hours(loopHours)} h`,
    });
  }
  if (chain.devices.some((d) => d.powered)) {
    items.push({
      code: 'labor_power_supply',
      label: 'Mount your power supply, cut its leads to length and fit new plugs',
      hours: serialHours,
      quantity: '1',
      unit: 'supply',
      explanation: `1 × ${hours(serialHours)} h`,
    });
  }
  for (const fn of functions) {
    const h = figure(fn.laborHours);
    items.push({
      code: `function_${fn.code}`,
      label: fn.name,
      hours: h,
      quantity: count(1),
      unit: 'function',
      explanation: fn.functionCount > 1 ? `${hours(h)} h (counts as ${fn.functionCount} functions)` : `${hours(h)} h`,
    });
  }
  return items;
}

/**
 * Prices a rig from one price book version: itemized materials, labor at the level's rate range,
 * totals, the deposit by the shop's policy, and the engineering checks. Pure: the same inputs
 * always give the same answer, so an old quote can be re-derived from its stored version.
 */
export function estimateRig(config: RigConfiguration, book: PriceBook, meta: { version: number; locale?: string }): EstimateResult {
  const index = bookIndex(book);
  const { surface, rigCase, functions, level } = resolve(config, book, index);
  const currency = book.currency;
  const digits = minorUnitDigits(currency)!;
  // Each line is rounded to the minor unit (ISO 4217) once, here; every total is a sum of these.
  const fmt = (v: Exact) => toFixedText(v, digits);

  const chain = signalChainOf(config);
  const schedule = cableScheduleOf(chain, functions, book.materials);
  const powerBudget = powerBudgetOf(chain, config.powerSupply?.outputs, book.power ?? DEFAULT_POWER_RULES);
  const boardFit = boardFitOf(chain, surface, book.surfaces);
  const complexity = complexityOf(chain, functions);
  const checks: RigChecks = { signalChain: chain, cableSchedule: schedule, powerBudget, boardFit, complexity };

  const m = book.materials;
  const mounted = chain.devices.length;
  const fastenerRate = chain.routing === 'switcher' ? m.fastenersPerPedalSwitcher : m.fastenersPerPedalSerial;
  const hookFeet = timesInt(figure(m.hookAndLoopFeetPerPedal), mounted);
  // Each line's amount is rounded to the minor unit once, and every total is the sum of those
  // rounded amounts, so the lines always add up to the totals exactly.
  const round = (v: Exact) => roundHalfUp(v, digits);
  const lines: EstimateLine[] = [];
  let materialsTotal = ZERO;
  const materialLine = (code: string, label: string, quantity: number | Exact, unit: string, unitPrice: string, explanation?: string) => {
    const amount = round(typeof quantity === 'number' ? timesInt(figure(unitPrice), quantity) : times(figure(unitPrice), quantity));
    materialsTotal = plus(materialsTotal, amount);
    const line: EstimateLine = {
      code,
      label,
      kind: 'materials',
      quantity: typeof quantity === 'number' ? count(quantity) : toFixedText(quantity, 2),
      unit,
      unitPrice,
      amount: fmt(amount),
    };
    if (explanation) line.explanation = explanation;
    lines.push(line);
  };

  materialLine('surface', surface.name, 1, 'each', surface.price);
  materialLine('case', rigCase.name, 1, 'each', rigCase.price);
  materialLine(
    'fasteners',
    'Fasteners, tie-down mounts and zip ties',
    mounted,
    'device',
    fastenerRate,
    `${chain.routing === 'switcher' ? 'switcher' : 'serial'} board rate per mounted device`,
  );
  materialLine('hook_and_loop', 'Hook-and-loop', hookFeet, 'ft', m.hookAndLoopPricePerFoot, `${m.hookAndLoopFeetPerPedal} ft per device`);
  if (schedule.patchCount > 0) {
    materialLine(
      'patch_cable',
      'Audio patch cable',
      figure(schedule.cableFeet),
      'ft',
      m.cablePricePerFoot,
      `${schedule.patchCount} patches × (${m.patchLengthFeet} ft + ${m.spareFeetPerPatch} ft spare)`,
    );
    materialLine('patch_plugs', 'Patch cable plugs', schedule.plugCount, 'plug', m.plugPrice, `2 per patch × ${schedule.patchCount}`);
  }
  if (schedule.barrelPlugCount > 0) {
    materialLine(
      'dc_barrel_plugs',
      'DC barrel plugs for your supply leads',
      schedule.barrelPlugCount,
      'plug',
      m.barrelPlugPrice,
      'one per powered device, the switcher too',
    );
  }

  const rateLow = figure(level.rateLow);
  const rateHigh = figure(level.rateHigh);
  const rateLowText = fmt(rateLow);
  const rateHighText = fmt(rateHigh);
  // The rate in words comes from the one formatter, with the currency ("$100.00–$150.00").
  const rateWords = rateWordsOf(index, level, currency, meta.locale);
  let laborHours = ZERO;
  let laborLow = ZERO;
  let laborHigh = ZERO;
  for (const item of laborItems(chain, functions, book)) {
    const low = round(times(item.hours, rateLow));
    const high = round(times(item.hours, rateHigh));
    laborHours = plus(laborHours, item.hours);
    laborLow = plus(laborLow, low);
    laborHigh = plus(laborHigh, high);
    const basis = `${item.quantity} ${item.unit}${item.quantity === '1' ? '' : 's'}: ${item.explanation}`;
    lines.push({
      code: item.code,
      label: item.label,
      kind: 'labor',
      quantity: hours(item.hours),
      unit: 'h',
      unitPrice: rateLowText,
      amount: fmt(low),
      amountHigh: fmt(high),
      explanation: w.laborAt(basis, rateWords),
      basis,
    });
  }

  const totalLow = plus(materialsTotal, laborLow);
  const totalHigh = plus(materialsTotal, laborHigh);

  return {
    priceBookVersion: meta.version,
    currency,
    level: config.level,
    lines,
    laborHours: hours(laborHours),
    materialsTotal: fmt(materialsTotal),
    laborLow: fmt(laborLow),
    laborHigh: fmt(laborHigh),
    totalLow: fmt(totalLow),
    totalHigh: fmt(totalHigh),
    deposit: fmt(depositOf(totalHigh, totalLow, book, digits)),
    rate: { low: rateLowText, high: rateHighText },
    minimumLevel: complexity.minimumLevel,
    minimumLevelReasons: complexity.reasons,
    notes: notesFor(config, checks, rigCase, index, 'player'),
    staffNotes: notesFor(config, checks, rigCase, index, 'staff'),
    checks,
  };
}

/**
 * The policy's share of the high end, never below its minimum, and never more than the low end
 * of the estimate itself; rounded to the currency's minor unit (ISO 4217).
 */
export function depositFor(totalHigh: Decimal.Value, totalLow: Decimal.Value, book: PriceBook, currency = book.currency): Decimal {
  // The currency's minor unit (roundToMinorUnit refuses a code ISO 4217 does not list, as it always did here).
  const digits = minorUnitDigits(currency) ?? roundToMinorUnit(0, currency).decimalPlaces();
  const deposit = depositOf(exactOf(new Decimal(totalHigh)), exactOf(new Decimal(totalLow)), book, digits);
  return new Decimal(toFixedText(deposit, digits));
}

/** depositFor on exact amounts, `digits` being the currency's minor unit. */
function depositOf(totalHigh: Exact, totalLow: Exact, book: PriceBook, digits: number): Exact {
  // percent / 100 is the same digits two places further right.
  const percent = figure(book.depositPolicy.percent);
  const share = times(totalHigh, { n: percent.n, scale: percent.scale + 2 });
  const minimum = figure(book.depositPolicy.minimum);
  const floor = compare(share, minimum) >= 0 ? share : minimum;
  return roundHalfUp(compare(floor, totalLow) <= 0 ? floor : totalLow, digits);
}

/** Who reads a note: the player (configurator, quote, build page) or the shop (backoffice, build sheet). */
export type NoteReader = 'player' | 'staff';

/**
 * The notes under an estimate, written for their reader: the player reads "your supply" and what
 * to do on which step; the shop reads the same facts as the bench would say them. Both carry the
 * usual safety cautions, deferring to local codes and licensed practice.
 */
function notesFor(
  config: RigConfiguration,
  checks: RigChecks,
  rigCase: PriceBook['cases'][number],
  index: BookIndex,
  reader: NoteReader,
): string[] {
  const forPlayer = reader === 'player';
  const notes: string[] = [];
  if (rigCase.notRecommended) {
    notes.push(
      rigCase.caution ?? `A ${rigCase.name} is not recommended for a loaded board: it does not protect the pedals and jacks in transit.`,
    );
  }
  const { complexity, powerBudget, boardFit } = checks;
  if (levelRank(config.level) < levelRank(complexity.minimumLevel)) {
    const level = index.levels.get(complexity.minimumLevel);
    const name = level?.name ?? complexity.minimumLevel;
    notes.push(
      forPlayer
        ? `This rig calls for at least a ${name} builder (${complexity.reasons.join('; ')}); the shop will assign one, at that level's rate.`
        : `This rig calls for at least a ${name} builder (${complexity.reasons.join('; ')}); it is priced at that level's rate.`,
    );
  }
  const unknownDraw = checks.signalChain.devices.filter((d) => d.powered && d.drawFromMemory);
  for (const warning of powerBudget.warnings) {
    const aboutUnknownDraw =
      unknownDraw.length > 0 && (warning.startsWith('Current draw unknown') || warning.startsWith('Power is planned at a typical draw'));
    if (aboutUnknownDraw && !forPlayer) {
      notes.push(
        checks.signalChain.fromCount
          ? `The player gave a count of ${unknownDraw.length} pedals, no list: power is planned at typical draws; check each pedal's label at intake.`
          : `No current draw given for ${unknownDraw.map((d) => d.name).join(', ')}: planned at a typical figure; check the label at intake.`,
      );
    } else notes.push(warning);
  }
  notes.push(...powerBudget.fixes.map((f) => `To power every pedal: ${f.charAt(0).toLowerCase()}${f.slice(1)}`));
  if (boardFit.status !== 'ok') notes.push(...boardFit.warnings.filter((w) => w !== TYPICAL_FOOTPRINTS_WARNING));
  if (checks.signalChain.loops.length > 12) {
    notes.push(
      `${checks.signalChain.loops.length} loops is more than most switchers have (8 to 12); ${forPlayer ? 'check yours' : 'check the player’s switcher'}.`,
    );
  }
  if (checks.signalChain.devices.some((d) => d.powered)) {
    notes.push(
      forPlayer
        ? 'Your supply plugs into the mains: any mains wiring or power inlet is work for a qualified person under local electrical codes.'
        : 'Mains: the supply plugs into the mains. Any mains wiring, power inlet or mains lead is work only for a qualified person under local electrical codes; never open a mains-powered supply.',
    );
  }
  if (rigCase.kind === 'road_case')
    notes.push(
      forPlayer
        ? 'A loaded road case is heavy: lift it with two people.'
        : 'A loaded road case is heavy: lift it with two people, and give the carrier its weight.',
    );
  notes.push(
    forPlayer
      ? 'Pedals, power supply and switcher are yours to supply; they are not in this estimate.'
      : 'Pedals, power supply and switcher come from the player; they are not in this estimate.',
  );
  return notes;
}
