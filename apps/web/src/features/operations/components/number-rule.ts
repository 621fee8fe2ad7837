/** A react-hook-form rule for a number typed as text, with its bounds. */
export const numberRule = (
  label: string,
  { min, max, integer = false }: { min: number; max: number; integer?: boolean },
) => ({
  required: `Give the ${label}`,
  validate: (value: string) => {
    const n = Number(value);
    if (String(value).trim() === '' || !Number.isFinite(n)) return `Give the ${label} as a number`;
    if (integer && !Number.isInteger(n)) return 'Give a whole number';
    if (n < min || n > max) return `Between ${min} and ${max}`;
    return true;
  },
});
