import { useState } from 'react';
import { CalendarPlus, Copy } from 'lucide-react';
import { formatTimestampDate } from '@shared/format';
import type { CalendarFeed } from '@shared/schemas/timeline';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { Spinner } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api-client';
import { useCreateCalendarFeed } from '../api/create-calendar-feed';
import { useDeleteCalendarFeed } from '../api/delete-calendar-feed';
import { useCalendarFeed } from '../api/get-calendar-feed';

function NewLink({ feed }: { feed: CalendarFeed }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor="calendar-link" className="font-semibold">
        Your calendar link
      </label>
      <div className="flex flex-col gap-2 sm:flex-row">
        <input
          id="calendar-link"
          readOnly
          value={feed.url}
          onFocus={(e) => e.currentTarget.select()}
          className="min-h-11 w-full min-w-0 rounded-md border border-rule-strong bg-white px-3 font-mono text-sm"
        />
        <Button
          variant="secondary"
          size="sm"
          icon={<Copy aria-hidden className="size-4" />}
          onClick={() =>
            void navigator.clipboard?.writeText(feed.url!).then(
              () => setCopied(true),
              () => setCopied(false),
            )
          }
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </div>
      <a href={feed.webcalUrl} className={buttonClasses('primary', 'md', 'self-start')}>
        <CalendarPlus aria-hidden className="size-5" />
        Subscribe on this device
      </a>
      <p className="text-sm text-muted">
        Keep it to yourself: anyone with the link sees these dates. It is shown only now; make a new
        one to see it again (this one then stops working).
      </p>
    </div>
  );
}

/** My own calendar link: made, shown once, replaced or stopped. Every member may have one. */
export function CalendarPanel({ buildId, isShop }: { buildId: string; isShop: boolean }) {
  const feed = useCalendarFeed(buildId);
  const create = useCreateCalendarFeed();
  const remove = useDeleteCalendarFeed();
  const [stopping, setStopping] = useState(false);
  const make = () => create.mutate({ buildId });

  let body;
  if (feed.isPending) {
    body = (
      <p role="status" className="flex items-center gap-2 text-muted">
        <Spinner className="size-5" /> Loading…
      </p>
    );
  } else if (feed.isError) {
    body = (
      <div role="alert" className="flex flex-wrap items-center gap-3">
        <span>Your calendar link could not be loaded.</span>
        <Button variant="secondary" size="sm" onClick={() => void feed.refetch()}>
          Try again
        </Button>
      </div>
    );
  } else if (!feed.data) {
    body = (
      <Button
        icon={<CalendarPlus aria-hidden className="size-5" />}
        pending={create.isPending}
        onClick={make}
      >
        Make my calendar link
      </Button>
    );
  } else {
    body = (
      <div className="flex flex-col gap-3">
        {feed.data.url ? (
          <NewLink feed={feed.data} />
        ) : (
          <p className="text-ink-2">
            You made a link on {formatTimestampDate(feed.data.createdAt)}. It is shown only when it
            is made: make a new one to add the dates to another calendar.
          </p>
        )}
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" size="sm" pending={create.isPending} onClick={make}>
            Make a new link
          </Button>
          <Button
            variant="ghost"
            size="sm"
            onClick={() => {
              remove.reset();
              setStopping(true);
            }}
          >
            Stop the link
          </Button>
        </div>
      </div>
    );
  }

  return (
    <Section
      id="calendar"
      title="In your calendar"
      icon={<CalendarPlus aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-3">
        <p className="text-ink-2">
          Subscribe your phone’s calendar to the target date
          {isShop
            ? ' and the dates of the parts sent to you'
            : ', milestones, parts expected, send-outs due back and dyno days'}
          . It updates by itself; no money is in it.
        </p>
        {body}
        {create.isError && (
          <FormError
            message={isApiError(create.error) ? create.error.message : 'Could not make a link.'}
          />
        )}
        {remove.isSuccess && !feed.data && <Alert tone="ok">The link is stopped.</Alert>}
      </div>
      <ConfirmDialog
        open={stopping}
        title="Stop your calendar link?"
        confirmLabel="Stop the link"
        pending={remove.isPending}
        onClose={() => setStopping(false)}
        onConfirm={() => remove.mutate({ buildId }, { onSuccess: () => setStopping(false) })}
      >
        <p>Calendars subscribed to it get no more updates. You can make a new link at any time.</p>
        {remove.isError && <FormError message="Could not stop it. Try again." />}
      </ConfirmDialog>
    </Section>
  );
}
