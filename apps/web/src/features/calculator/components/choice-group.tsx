import { HStack, RadioGroup } from '@chakra-ui/react';
import { useController, type Control } from 'react-hook-form';
import type { CalculatorValues } from '../form-values';

type ChoiceField = 'setup' | 'frequencyMode' | 'shift';

export interface ChoiceGroupProps<F extends ChoiceField> {
  name: F;
  control: Control<CalculatorValues>;
  /** The group's accessible name. */
  label: string;
  options: readonly { value: CalculatorValues[F]; label: string }[];
  /** Called with the new choice before the form takes it. */
  onChoose?: (value: CalculatorValues[F]) => void;
}

/** A few exclusive choices as radio buttons (arrow keys move between them). */
export function ChoiceGroup<F extends ChoiceField>({
  name,
  control,
  label,
  options,
  onChoose,
}: ChoiceGroupProps<F>) {
  const { field } = useController({ name, control });
  return (
    <RadioGroup.Root
      name={field.name}
      value={field.value}
      onValueChange={({ value }) => {
        if (value === null) return;
        const choice = value as CalculatorValues[F];
        onChoose?.(choice);
        field.onChange(choice);
      }}
      aria-label={label}
      size="sm"
    >
      <HStack gap="5" wrap="wrap">
        {options.map((option) => (
          <RadioGroup.Item key={option.value} value={option.value}>
            <RadioGroup.ItemHiddenInput onBlur={field.onBlur} />
            <RadioGroup.ItemIndicator />
            <RadioGroup.ItemText>{option.label}</RadioGroup.ItemText>
          </RadioGroup.Item>
        ))}
      </HStack>
    </RadioGroup.Root>
  );
}
