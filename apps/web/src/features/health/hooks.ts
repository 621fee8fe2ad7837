import { useQuery } from '@tanstack/react-query';
import { healthQueryOptions } from './api';

export const useHealth = () => useQuery(healthQueryOptions());
