import { Eye } from 'lucide-react';
import type { ShareSettings } from '@shared/schemas/sharing';
import { shareSectionHints, shareSectionLabels, shareSections } from '@shared/sharing/vocabulary';
import { Section } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { useUpdateShare } from '../api/update-share';
import { SwitchRow } from './switch-row';

/** What the public page shows: a switch per section, members' names, search engines. */
export function ShareChoices({ buildId, share }: { buildId: string; share: ShareSettings }) {
  const update = useUpdateShare(buildId);
  return (
    <Section
      id="share-choices"
      title="What the page shows"
      icon={<Eye aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-4">
        <p className="text-ink-2">
          Each change shows on the page the next time someone opens or reloads it.
        </p>
        <div className="divide-y divide-rule">
          {shareSections.map((section) => (
            <SwitchRow
              key={section}
              label={shareSectionLabels[section]}
              description={shareSectionHints[section]}
              checked={share.sections[section]}
              onChange={(on) => update.mutate({ sections: { [section]: on } })}
            />
          ))}
        </div>
        <h3 className="border-t border-rule pt-4 font-bold">People and search engines</h3>
        <div className="divide-y divide-rule">
          <SwitchRow
            label="Show members’ names"
            description="Who signed off a step and who is on the crew. Off, the page says neither; e-mail addresses never show."
            checked={share.showMemberNames}
            onChange={(showMemberNames) => update.mutate({ showMemberNames })}
          />
          <SwitchRow
            label="Let search engines list the page"
            description="Off, the page asks search engines not to list it, so only people you send the address to find it."
            checked={share.allowIndexing}
            onChange={(allowIndexing) => update.mutate({ allowIndexing })}
          />
        </div>
        <FormError message={update.error?.message} />
      </div>
    </Section>
  );
}
