import { lazy, Suspense } from 'react';
import { BlockLoader } from '@/components/ui/loading';
import type { ChartsProps } from './charts';

// The chart package is most of a plot's weight: it comes in its own chunk, after the numbers.
const CalculatorCharts = lazy(() => import('./charts'));

export function Plots(props: ChartsProps) {
  return (
    <Suspense fallback={<BlockLoader label="Loading the plots" lines={6} />}>
      <CalculatorCharts {...props} />
    </Suspense>
  );
}
