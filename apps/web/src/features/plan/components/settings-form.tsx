import { Button, HStack, Input, Stack } from '@chakra-ui/react';
import { useForm } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import type { Plan, PlanSettings } from '../api';
import { useSavePlanSettings } from '../hooks';

interface SettingsForm {
  maintenanceStartHour: string;
  maintenanceHours: string;
  /** Percent in the form; a fraction on the wire. */
  weatherReserve: string;
}

const FIELDS = ['maintenanceStartHour', 'maintenanceHours', 'weatherReserve'] as const;

/** The plan's maintenance window (site's local time) and weather reserve. */
export function PlanSettingsForm({ plan }: { plan: Plan }) {
  const save = useSavePlanSettings(plan.call.code);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SettingsForm>({
    values: {
      maintenanceStartHour: String(plan.settings.maintenanceStartHour),
      maintenanceHours: String(plan.settings.maintenanceHours),
      weatherReserve: String(Math.round(plan.settings.weatherReserve * 1000) / 10),
    },
  });
  const onSubmit = handleSubmit((values) => {
    const settings: PlanSettings = {
      maintenanceStartHour: Number(values.maintenanceStartHour),
      maintenanceHours: Number(values.maintenanceHours),
      weatherReserve: Number(values.weatherReserve) / 100,
    };
    save.mutate(settings, {
      onSuccess: () => toaster.create({ type: 'success', title: 'Plan settings saved' }),
      onError: (error) => setServerErrors(error, setError, FIELDS),
    });
  });
  const whole = (label: string, min: number, max: number) => ({
    required: `${label} is needed`,
    validate: (v: string) =>
      (/^\d+$/.test(v) && Number(v) >= min && Number(v) <= max) ||
      `${label} is a whole number from ${min} to ${max}`,
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Plan settings">
      <Stack gap="3">
        <HStack gap="4" align="start" wrap="wrap">
          <FormField
            label="Maintenance starts (hour)"
            helperText={`Local time at the site, ${plan.site.timeZone}`}
            error={errors.maintenanceStartHour}
            maxW="14rem"
          >
            <Input
              inputMode="numeric"
              {...register('maintenanceStartHour', whole('The start hour', 0, 23))}
            />
          </FormField>
          <FormField
            label="Maintenance length (hours)"
            helperText="0 for none"
            error={errors.maintenanceHours}
            maxW="14rem"
          >
            <Input
              inputMode="numeric"
              {...register('maintenanceHours', whole('The length', 0, 23))}
            />
          </FormField>
          <FormField
            label="Weather reserve (%)"
            helperText="Share of usable time held back"
            error={errors.weatherReserve}
            maxW="14rem"
          >
            <Input
              inputMode="decimal"
              {...register('weatherReserve', {
                required: 'The reserve is needed',
                validate: (v) =>
                  (v.trim() !== '' && Number(v) >= 0 && Number(v) <= 90) ||
                  'The reserve is a percentage from 0 to 90',
              })}
            />
          </FormField>
        </HStack>
        <FormError error={errors.root?.server} />
        <HStack>
          <Button type="submit" variant="outline" loading={save.isPending}>
            Save settings
          </Button>
        </HStack>
      </Stack>
    </form>
  );
}
