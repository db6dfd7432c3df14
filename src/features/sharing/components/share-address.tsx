import { useState } from 'react';
import { Check, Copy, ExternalLink, Globe, Printer, RefreshCw } from 'lucide-react';
import type { ShareSettings } from '@shared/schemas/sharing';
import { paths } from '@/config/paths';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink, buttonClasses } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { useRegenerateShare } from '../api/regenerate-share';
import { useUpdateShare } from '../api/update-share';
import { SwitchRow } from './switch-row';

/** The public page's switch and address: copy it, open it, or give it a new one. */
export function ShareAddress({ buildId, share }: { buildId: string; share: ShareSettings }) {
  const update = useUpdateShare(buildId);
  const renew = useRegenerateShare(buildId);
  const [confirming, setConfirming] = useState(false);
  const [copied, setCopied] = useState(false);
  const [renewed, setRenewed] = useState(false);

  const copy = async () => {
    if (!share.url) return;
    try {
      await navigator.clipboard.writeText(share.url);
      setCopied(true);
    } catch {
      // No clipboard (an old browser, or not allowed): the address is selectable in its box.
      setCopied(false);
    }
  };

  return (
    <Section
      id="share-page"
      title="Public page"
      icon={<Globe aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-4">
        <SwitchRow
          label="Share this build on a public page"
          description="Anyone with the address can read what you choose below, without an account. They cannot change anything. Prices, vendors, notes and e-mail addresses never show."
          checked={share.enabled}
          onChange={(enabled) => update.mutate({ enabled })}
        />
        <FormError message={update.error?.message} />
        {share.enabled && share.url && share.token && (
          <div className="flex flex-col gap-3">
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Address of the page</span>
              <input
                readOnly
                value={share.url}
                onFocus={(event) => event.currentTarget.select()}
                className="min-h-11 w-full rounded-md border border-rule-strong bg-white px-3 font-mono text-sm text-ink"
              />
            </label>
            <div className="flex flex-wrap gap-2">
              <Button
                variant="secondary"
                onClick={() => void copy()}
                icon={
                  copied ? (
                    <Check aria-hidden className="size-4" />
                  ) : (
                    <Copy aria-hidden className="size-4" />
                  )
                }
              >
                {copied ? 'Copied' : 'Copy address'}
              </Button>
              <a
                href={paths.shared.page.getHref(share.token)}
                target="_blank"
                rel="noreferrer"
                className={buttonClasses('secondary')}
              >
                <ExternalLink aria-hidden className="size-4" />
                Open the public page
              </a>
              <ButtonLink
                to={paths.shared.sheet.getHref(share.token)}
                variant="secondary"
                icon={<Printer aria-hidden className="size-4" />}
              >
                Public build sheet
              </ButtonLink>
              <Button
                variant="ghost"
                onClick={() => {
                  setRenewed(false);
                  setConfirming(true);
                }}
                icon={<RefreshCw aria-hidden className="size-4" />}
              >
                New address
              </Button>
            </div>
            {renewed && (
              <Alert tone="ok">
                The page has a new address. The old one now says the build is not shared.
              </Alert>
            )}
          </div>
        )}
        {!share.enabled && share.token && (
          <p className="text-sm text-muted">
            The page is off: its address shows &ldquo;not shared&rdquo; until you switch it on
            again.
          </p>
        )}
      </div>
      <ConfirmDialog
        open={confirming}
        title="Give the page a new address?"
        confirmLabel="Make a new address"
        pending={renew.isPending}
        onClose={() => setConfirming(false)}
        onConfirm={() =>
          renew.mutate(undefined, {
            onSuccess: () => {
              setConfirming(false);
              setRenewed(true);
              setCopied(false);
            },
          })
        }
      >
        <p>
          The address you have shared stops working at once: anyone who opens it is told the build
          is not shared. Send the new address to the people who should still see the page.
        </p>
        <FormError message={renew.error?.message} />
      </ConfirmDialog>
    </Section>
  );
}
