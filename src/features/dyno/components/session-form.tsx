import { useForm } from 'react-hook-form';
import { buildToday } from '@shared/dates';
import {
  createDynoSessionInputSchema,
  dynoKindLabels,
  dynoKinds,
  type CreateDynoSessionInput,
  type DynoKind,
  type DynoSession,
} from '@shared/schemas/dyno';
import { FormActions } from '@/components/ui/form-actions';
import {
  FieldGroup,
  FormField,
  SelectInput,
  TextArea,
  TextInput,
} from '@/components/ui/form-field';
import { FormError } from '@/components/ui/form-error';
import { Modal } from '@/components/ui/modal';
import { useBuild } from '@/features/builds/api/get-build';
import { useMembers } from '@/features/members/api/get-members';
import { useCreateDynoSession } from '../api/create-dyno-session';
import { useUpdateDynoSession } from '../api/update-dyno-session';
import {
  applyFieldErrors,
  schemaResolver,
  weatherFromForm,
  weatherToForm,
  type WeatherFormValues,
} from '../form';
import { WeatherFields } from './weather-fields';

type SessionFormValues = WeatherFormValues & {
  date: string;
  place: string;
  dynoKind: DynoKind;
  runBy: string;
  notes: string;
  shopUserId: string;
};

function toInput(v: SessionFormValues, canAssign: boolean): CreateDynoSessionInput {
  return {
    date: v.date,
    place: v.place,
    dynoKind: v.dynoKind,
    runBy: v.runBy,
    notes: v.notes,
    weather: weatherFromForm(v),
    ...(canAssign ? { shopUserId: v.shopUserId || null } : {}),
  };
}

/**
 * A dyno day: when, where, which kind of dyno (which decides wheel or crank figures), who ran
 * it, the weather, and — for owner and crew — the shop whose dyno it is.
 */
export function SessionFormDialog({
  open,
  buildId,
  session,
  canAssign,
  onClose,
  onSaved,
}: {
  open: boolean;
  buildId: string;
  session?: DynoSession;
  /** Owner and crew may assign the session to a shop member. */
  canAssign: boolean;
  onClose: () => void;
  onSaved: (session: DynoSession) => void;
}) {
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={session ? 'Edit the dyno session' : 'New dyno session'}
      description="Figures are kept as measured; the weather lets Headroom correct them to a standard."
    >
      {open && (
        <SessionForm
          buildId={buildId}
          session={session}
          canAssign={canAssign}
          onCancel={onClose}
          onSaved={onSaved}
        />
      )}
    </Modal>
  );
}

function SessionForm({
  buildId,
  session,
  canAssign,
  onCancel,
  onSaved,
}: {
  buildId: string;
  session?: DynoSession;
  canAssign: boolean;
  onCancel: () => void;
  onSaved: (session: DynoSession) => void;
}) {
  const create = useCreateDynoSession();
  const update = useUpdateDynoSession();
  const members = useMembers(buildId);
  // The page has the build already; a new session is dated the build's today.
  const timeZone = useBuild(buildId).data?.timeZone ?? null;
  const shops = (members.data ?? []).filter((m) => m.role === 'shop');
  const {
    register,
    handleSubmit,
    watch,
    setError,
    getValues,
    formState: { errors, isSubmitting },
  } = useForm<SessionFormValues, unknown, CreateDynoSessionInput>({
    resolver: schemaResolver(createDynoSessionInputSchema, (v: SessionFormValues) =>
      toInput(v, canAssign),
    ),
    defaultValues: {
      date: session?.date ?? buildToday({ timeZone }),
      place: session?.place ?? '',
      dynoKind: session?.dynoKind ?? 'chassis',
      runBy: session?.runBy ?? '',
      notes: session?.notes ?? '',
      shopUserId: session?.shop?.id ?? '',
      ...weatherToForm(session?.weather ?? null),
    },
    mode: 'onTouched',
  });

  const submit = handleSubmit(async (input) => {
    try {
      const saved = session
        ? await update.mutateAsync({ buildId, sessionId: session.id, input })
        : await create.mutateAsync({ buildId, input });
      onSaved(saved);
    } catch (error) {
      applyFieldErrors(error, setError, getValues());
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      <FormError message={errors.root?.server?.message ?? errors.root?.message} />
      <FieldGroup legend="The day">
        <FormField label="Date" error={errors.date?.message}>
          {(c) => <TextInput {...c} type="date" {...register('date')} />}
        </FormField>
        <FormField label="Place" optional error={errors.place?.message}>
          {(c) => <TextInput {...c} {...register('place')} />}
        </FormField>
        <FormField
          label="Kind of dyno"
          hint="A chassis dyno reads power at the wheels; an engine dyno at the crank"
          error={errors.dynoKind?.message}
          className="sm:col-span-2"
        >
          {(c) => (
            <SelectInput {...c} {...register('dynoKind')}>
              {dynoKinds.map((k) => (
                <option key={k} value={k}>
                  {dynoKindLabels[k]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
        <FormField label="Who ran it" optional error={errors.runBy?.message}>
          {(c) => <TextInput {...c} {...register('runBy')} />}
        </FormField>
        {canAssign && (
          <FormField
            label="Shop whose dyno it is"
            optional
            hint="That shop sees this session and records its runs"
            error={errors.shopUserId?.message}
          >
            {(c) => (
              <SelectInput {...c} {...register('shopUserId')}>
                <option value="">None</option>
                {shops.map((s) => (
                  <option key={s.userId} value={s.userId}>
                    {s.displayName}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
        )}
        <FormField label="Notes" optional error={errors.notes?.message} className="sm:col-span-2">
          {(c) => <TextArea {...c} rows={3} {...register('notes')} />}
        </FormField>
      </FieldGroup>
      <FieldGroup
        legend="Weather at the dyno"
        description="For every run without its own weather. Leave temperature and pressure empty if none was recorded: the runs then stay as measured."
      >
        <div className="sm:col-span-2">
          <WeatherFields register={register} errors={errors} humidityKind={watch('humidityKind')} />
        </div>
      </FieldGroup>
      <FormActions
        onCancel={onCancel}
        submitLabel={session ? 'Save changes' : 'Add session'}
        pending={isSubmitting}
      />
    </form>
  );
}
