import { Group, Input, NativeSelect } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import type { UseFormRegister } from 'react-hook-form';
import { FormField } from '@/components/ui/form-field';
import { UNIT_LABELS, type CalculatorValues, type FieldName } from '../form-values';

type UnitField =
  'frequencyUnit' | 'restUnit' | 'extentUnit' | 'resolutionUnit' | 'rmsUnit' | 'timeUnit';

export interface QuantityFieldProps {
  name: FieldName;
  label: ReactNode;
  register: UseFormRegister<CalculatorValues>;
  error?: string;
  helperText?: ReactNode;
  required?: boolean;
  /** A choice of units beside the number, with its own accessible name. */
  unit?: { name: UnitField; label: string; options: readonly (keyof typeof UNIT_LABELS)[] };
  /** Coordinates and the like: text that is not only digits. */
  inputMode?: 'decimal' | 'text';
  placeholder?: string;
}

/** One number the user types, with its label, its error and optionally its unit. */
export function QuantityField({
  name,
  label,
  register,
  error,
  helperText,
  required,
  unit,
  inputMode = 'decimal',
  placeholder,
}: QuantityFieldProps) {
  const input = (
    <Input
      {...register(name)}
      inputMode={inputMode}
      autoComplete="off"
      spellCheck={false}
      placeholder={placeholder}
      fontVariantNumeric="tabular-nums"
    />
  );
  return (
    <FormField label={label} error={error} helperText={helperText} required={required}>
      {unit ? (
        <Group attached w="full">
          {input}
          <NativeSelect.Root width="auto" flexShrink={0}>
            {/* Its own id: Field.Root would otherwise give it the number's id as well. */}
            <NativeSelect.Field
              id={`${name}-unit`}
              aria-label={unit.label}
              {...register(unit.name)}
            >
              {unit.options.map((option) => (
                <option key={option} value={option}>
                  {UNIT_LABELS[option]}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </Group>
      ) : (
        input
      )}
    </FormField>
  );
}
