import Alert from '@mui/joy/Alert';
import Box from '@mui/joy/Box';
import Button from '@mui/joy/Button';
import Input from '@mui/joy/Input';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { useState } from 'react';
import { Link as RouterLink, useLocation } from 'react-router';
import type { RigConfiguration } from '@loomwright/shared';
import { useMe, useSearchParamsInOrder } from '@loomwright/shared/ui';
import { useCreateShortLink } from '../api/create-short-link';
import { useEmailQuote } from '../api/email-quote';
import { useSavedConfiguration } from '../api/get-saved-configuration';
import { useSaveConfiguration } from '../api/save-configuration';
import { useUpdateConfiguration } from '../api/update-configuration';
import { NameDialog } from './NameDialog';
import { sameConfiguration } from './same-configuration';

/** The address bar names the saved configuration being edited, so a reload keeps "Save changes". */
export const SAVED_PARAM = 'saved';

interface Props {
  configuration: RigConfiguration;
  /** False while the estimate is catching up with the latest change. */
  ready: boolean;
}

/**
 * Keeping a configuration: save it under a name (or save changes to the one reopened), copy a
 * short link to it, and have its quote e-mailed. Saving and e-mail need an account; the link does not.
 */
export default function KeepConfiguration({ configuration, ready }: Props) {
  const me = useMe();
  const location = useLocation();
  const [params, setParams] = useSearchParamsInOrder();
  const savedId = params.get(SAVED_PARAM);
  const signedIn = !!me.data;
  const saved = useSavedConfiguration(savedId, signedIn);
  const save = useSaveConfiguration();
  const update = useUpdateConfiguration();
  const link = useCreateShortLink();
  const email = useEmailQuote();
  const [dialog, setDialog] = useState(false);
  const [copied, setCopied] = useState<'copied' | 'select' | null>(null);

  const current = saved.data;
  const unchanged = current ? sameConfiguration(current.configuration, configuration) : false;
  const signInHref = `/sign-in?next=${encodeURIComponent(`${location.pathname}${location.search}`)}`;

  const saveAsNew = (name: string) =>
    save.mutate(
      { name, configuration },
      {
        onSuccess: (created) => {
          setDialog(false);
          setParams(
            (prev) => {
              const next = new URLSearchParams(prev);
              next.set(SAVED_PARAM, created.id);
              return next;
            },
            { replace: true, state: { configurator: true } },
          );
        },
      },
    );

  const copyLink = () =>
    link.mutate(configuration, {
      onSuccess: async ({ path }) => {
        const url = `${window.location.origin}${path}`;
        try {
          await navigator.clipboard.writeText(url);
          setCopied('copied');
        } catch {
          // No clipboard (an older browser, or permission refused): the link is shown to copy by hand.
          setCopied('select');
        }
      },
    });
  const shortUrl = link.data ? `${window.location.origin}${link.data.path}` : null;

  return (
    <Stack gap={2}>
      <Box component="section" aria-labelledby="save-heading">
        <Typography level="title-md" component="h4" id="save-heading">
          Save it to your account
        </Typography>
        {!signedIn ? (
          <Typography level="body-sm">
            <Link component={RouterLink} to={signInHref}>
              Sign in
            </Link>{' '}
            to save configurations under a name, reopen them later and have quotes e-mailed to you. What you configured here stays as it is.
          </Typography>
        ) : (
          <Stack gap={1} sx={{ mt: 0.5 }}>
            {current ? (
              <Typography level="body-sm" data-testid="saved-status">
                {unchanged ? `Saved as “${current.name}”.` : `You changed “${current.name}” since it was saved.`}
              </Typography>
            ) : saved.isError ? (
              <Typography level="body-sm">
                The saved configuration this page came from is no longer in your account; save it again under a name.
              </Typography>
            ) : null}
            <Stack direction="row" gap={1} flexWrap="wrap">
              {current ? (
                <Button
                  disabled={!ready || unchanged}
                  loading={update.isPending}
                  onClick={() => update.mutate({ id: current.id, configuration })}
                >
                  Save changes to “{current.name}”
                </Button>
              ) : null}
              <Button variant={current ? 'outlined' : 'solid'} disabled={!ready} onClick={() => setDialog(true)}>
                {current ? 'Save as a new configuration…' : 'Save under a name…'}
              </Button>
              <Button component={RouterLink} to="/configurations" variant="plain">
                Saved boards
              </Button>
            </Stack>
            {update.isError ? (
              <Typography role="alert" level="body-sm" sx={{ color: 'danger.700' }}>
                {update.error.message}
              </Typography>
            ) : null}
          </Stack>
        )}
      </Box>

      <Box component="section" aria-labelledby="share-heading">
        <Typography level="title-md" component="h4" id="share-heading">
          Share it
        </Typography>
        <Typography level="body-sm" sx={{ mb: 1 }}>
          A short link that opens this configuration, for you on another device or for a bandmate.
        </Typography>
        <Button variant="outlined" disabled={!ready} loading={link.isPending} onClick={copyLink}>
          Copy link
        </Button>
        {shortUrl ? (
          <Stack gap={0.5} sx={{ mt: 1, maxWidth: 420 }}>
            <Typography level="body-sm" role="status">
              {copied === 'copied' ? 'Link copied. It opens this configuration:' : 'Copy this link (it opens this configuration):'}
            </Typography>
            <Input
              readOnly
              value={shortUrl}
              aria-label="Short link to this configuration"
              onFocus={(e) => e.currentTarget.select()}
              autoFocus={copied === 'select'}
            />
          </Stack>
        ) : null}
        {link.isError ? (
          <Typography role="alert" level="body-sm" sx={{ color: 'danger.700', mt: 1 }}>
            {link.error.message}
          </Typography>
        ) : null}
      </Box>

      <Box component="section" aria-labelledby="email-heading">
        <Typography level="title-md" component="h4" id="email-heading">
          E-mail the quote
        </Typography>
        {signedIn ? (
          <>
            <Typography level="body-sm" sx={{ mb: 1 }}>
              To {me.data!.email}, with the PDF attached and a link back to this configuration.
            </Typography>
            <Button
              variant="outlined"
              disabled={!ready}
              loading={email.isPending}
              onClick={() => email.mutate({ configuration, ...(current && { title: current.name }) })}
            >
              E-mail it to me
            </Button>
            {email.isSuccess ? (
              <Alert color="success" variant="soft" role="status" sx={{ mt: 1 }}>
                Sent to {email.data.sentTo}. It should arrive within a few minutes
                {email.data.remaining === 0 ? '; that was the last quote e-mail for this hour.' : '.'}
              </Alert>
            ) : null}
            {email.isError ? (
              <Typography role="alert" level="body-sm" sx={{ color: 'danger.700', mt: 1 }}>
                {email.error.message}
              </Typography>
            ) : null}
          </>
        ) : (
          <Typography level="body-sm">
            <Link component={RouterLink} to={signInHref}>
              Sign in
            </Link>{' '}
            to have the quote e-mailed to you, or download the PDF above.
          </Typography>
        )}
      </Box>

      <NameDialog
        open={dialog}
        title={current ? 'Save as a new configuration' : 'Save this configuration'}
        hint="A name you will recognise later, like “Stage board” or “Fly rig”."
        submitLabel="Save"
        initialName={current ? `${current.name} (new)` : ''}
        pending={save.isPending}
        error={save.error?.message}
        onSubmit={saveAsNew}
        onClose={() => {
          setDialog(false);
          save.reset();
        }}
      />
    </Stack>
  );
}
