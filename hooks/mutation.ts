import type { UseMutationResult, UseQueryResult } from '@tanstack/react-query';
import type { ApiError } from './api';

/**
 * A mutation as a screen hands it to a component: the component starts it (`mutate`) and shows its progress and
 * outcome; the screen called the hook, so the component never reaches the API itself.
 */
export type Mutation<TInput = void, TData = unknown> = UseMutationResult<TData, ApiError, TInput>;

/** A query as a screen hands it to a component that shows its loading and failure itself. */
export type QueryState<TData> = UseQueryResult<TData, Error>;
