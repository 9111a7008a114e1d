import { z } from 'zod';
import { rigConfigurationSchema } from './estimate/schema';
import type { RigConfiguration } from './estimate/types';
import { requestObject, text } from './request-fields';

/** A saved configuration's name: what the player calls the rig ("Stage board", "Bass rig 2027"). */
export const configurationName = () =>
  text('name', { min: 1, max: 120, tooShort: 'Give the configuration a name (name), like "Stage board"' });

/** How many configurations one player may keep: plenty for real use, a bound on abuse. */
export const MAX_SAVED_CONFIGURATIONS = 50;

/** POST /api/configurations: keep a configuration under a name. */
export const saveConfigurationSchema = requestObject({
  name: configurationName(),
  configuration: rigConfigurationSchema,
});
export type SaveConfigurationInput = z.infer<typeof saveConfigurationSchema>;

/** PATCH /api/configurations/:id: rename it, save changes to it, or both. */
export const updateConfigurationSchema = requestObject({
  name: configurationName().optional(),
  configuration: rigConfigurationSchema.optional(),
}).refine((body) => body.name !== undefined || body.configuration !== undefined, {
  error: 'Send a new name, a changed configuration, or both',
});
export type UpdateConfigurationInput = z.infer<typeof updateConfigurationSchema>;

/** POST /api/configurations/:id/duplicate: a copy, under the name given or "<name> (copy)". */
export const duplicateConfigurationSchema = requestObject({ name: configurationName().optional() });
export type DuplicateConfigurationInput = z.infer<typeof duplicateConfigurationSchema>;

/** The form in the storefront: only the name (the configuration comes from the configurator). */
export const configurationNameFormSchema = z.object({ name: configurationName() });
export type ConfigurationNameForm = z.infer<typeof configurationNameFormSchema>;

/** POST /api/configuration-links: a short code for any configuration (saved or not). */
export const configurationLinkSchema = requestObject({ configuration: rigConfigurationSchema });
export type ConfigurationLinkInput = z.infer<typeof configurationLinkSchema>;

/** The code in /c/<code>: letters and digits only (no look-alike-prone punctuation in a link). */
export const SHORT_LINK_CODE = /^[A-Za-z0-9]{6,16}$/;
export const shortLinkPath = (code: string) => `/c/${code}`;

/** POST /api/quotes/email: the quote of any configuration, to the signed-in person's own address. */
export const emailQuoteSchema = requestObject({
  configuration: rigConfigurationSchema,
  /** The quote's title (a saved configuration's name); "Quote" when left out. */
  title: text('title', { max: 120 }).optional(),
});
export type EmailQuoteInput = z.infer<typeof emailQuoteSchema>;

/** Quotes one person may have e-mailed to them in an hour (each carries a PDF). */
export const QUOTE_EMAILS_PER_HOUR = 5;

/** One row of GET /api/configurations. */
export interface SavedConfigurationSummary {
  id: string;
  name: string;
  createdAt: string;
  updatedAt: string;
  /** Enough to tell rigs apart in a list. */
  surfaceId: string;
  routing: RigConfiguration['routing']['mode'];
  pedalCount: number;
}

/** GET /api/configurations/:id and the answers of the writes. */
export interface SavedConfiguration extends SavedConfigurationSummary {
  configuration: RigConfiguration;
}

export interface ConfigurationLink {
  code: string;
  /** The storefront path the code opens, e.g. /c/Ab3dE9xQ. */
  path: string;
}

/** GET /api/configuration-links/:code: the configuration a short link stands for. */
export interface SharedConfiguration {
  configuration: RigConfiguration;
}

export interface QuoteEmailSent {
  sentTo: string;
  /** How many more quotes may be e-mailed this hour. */
  remaining: number;
}

export const configurationMessages = {
  notFound: 'There is no saved configuration with that id among yours.',
  nameTaken: (name: string) => `You already keep a configuration named "${name}"; choose another name.`,
  tooMany: `You can keep up to ${MAX_SAVED_CONFIGURATIONS} configurations; delete one you no longer need first.`,
  linkNotFound: 'That link does not lead to a configuration; it may be mistyped. Ask whoever sent it for the link again.',
  quoteEmailLimit: `You can have up to ${QUOTE_EMAILS_PER_HOUR} quotes e-mailed to you in an hour; please try again later or download the PDF instead.`,
} as const;
