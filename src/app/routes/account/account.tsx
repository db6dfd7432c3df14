import { KeyRound, Mail, UserRound, Wrench } from 'lucide-react';
import { paths } from '@/config/paths';
import { PageHeader } from '@/app/layouts/page-header';
import { Section } from '@/components/ui/card';
import { EmailForm } from '@/features/account/components/email-form';
import { PasswordForm } from '@/features/account/components/password-form';
import { ProfileForm } from '@/features/account/components/profile-form';
import { WrenchList } from '@/features/wrenches/components/wrench-list';
import { useUser } from '@/lib/auth';

/** "/account": my name, e-mail address, password and torque wrenches. */
export function AccountRoute() {
  const user = useUser();
  return (
    <>
      <title>Your account · Headroom</title>
      <PageHeader
        back={{ to: paths.builds.list.getHref(), label: 'My builds' }}
        title="Your account"
        subtitle={<span className="break-all">{user.email}</span>}
      />
      <div className="grid gap-5 lg:grid-cols-2 lg:items-start">
        <div className="flex flex-col gap-5">
          <Section
            id="name"
            title="Name"
            icon={<UserRound aria-hidden className="size-5 text-ink-3" />}
          >
            <ProfileForm user={user} />
          </Section>
          <Section
            id="email"
            title="E-mail address"
            icon={<Mail aria-hidden className="size-5 text-ink-3" />}
          >
            <EmailForm user={user} />
          </Section>
          <Section
            id="password"
            title="Password"
            icon={<KeyRound aria-hidden className="size-5 text-ink-3" />}
          >
            <PasswordForm user={user} />
          </Section>
        </div>
        <Section
          id="wrenches"
          title="Torque wrenches"
          icon={<Wrench aria-hidden className="size-5 text-ink-3" />}
        >
          <WrenchList />
        </Section>
      </div>
    </>
  );
}
