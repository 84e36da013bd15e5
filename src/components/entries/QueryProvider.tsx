/** The entry islands' import path for the one TanStack Query provider, which lives in ../QueryProvider. */
export { QueryProvider } from '@/components/QueryProvider';
