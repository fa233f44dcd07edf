import type { components } from '@lumenwright/sdk';

export type ApiKey = components['schemas']['ApiKeyResponseDto'];
export type ApiKeyCreated = components['schemas']['ApiKeyCreatedResponseDto'];
export type ApiKeyPage = components['schemas']['ApiKeyPageResponseDto'];
export type CreateApiKeyBody = components['schemas']['CreateApiKeyRequestDto'];

/** Query keys for API keys; every mutation invalidates `keyKeys.all`. */
export const keyKeys = {
  all: ['keys'] as const,
  lists: () => [...keyKeys.all, 'list'] as const,
  list: (cursor: string | undefined) => [...keyKeys.lists(), { cursor: cursor ?? null }] as const,
};

export const KEYS_PAGE_SIZE = 20;
