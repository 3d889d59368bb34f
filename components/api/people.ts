import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UserDto } from '@/shared/schemas/auth';
import type {
  ActivityDto,
  HandoverDto,
  InvitationAcceptInput,
  InvitationCreateInput,
  InvitationInfoDto,
  MemberDto,
  MembersDto,
  MemberUpdateInput,
} from '@/shared/schemas/people';
import { apiariesKey, apiaryKey } from './apiaries';
import { fetchMe, meKey } from './auth';
import { cacheLife } from './cache';
import { apiFetch } from './client';

/** Key root for people: members and invitations per apiary, the Handover, the activity trail. */
export const peopleRoot = ['people'] as const;
export const membersKey = (apiaryId: string) => [...peopleRoot, 'members', apiaryId] as const;
export const handoverKey = (apiaryId: string) => [...peopleRoot, 'handover', apiaryId] as const;
export const activityKey = (apiaryId: string) => [...peopleRoot, 'activity', apiaryId] as const;
export const invitationKey = (token: string) => [...peopleRoot, 'invitation', token] as const;

const enc = encodeURIComponent;

export function useMembersQuery(apiaryId: string | undefined, enabled = true) {
  return useQuery({
    queryKey: membersKey(apiaryId ?? ''),
    queryFn: ({ signal }) => apiFetch<MembersDto>(`/api/apiaries/${enc(apiaryId ?? '')}/members`, { signal }),
    enabled: Boolean(apiaryId) && enabled,
    ...cacheLife.list,
  });
}

export function useInvitationCreateMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationCreateInput) =>
      apiFetch<{ invitation: { id: string; email: string } }>(`/api/apiaries/${enc(apiaryId)}/invitations`, { method: 'POST', body: input }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: membersKey(apiaryId) }),
  });
}

export function useInvitationRevokeMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => apiFetch<void>(`/api/apiaries/${enc(apiaryId)}/invitations/${enc(invitationId)}`, { method: 'DELETE' }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: membersKey(apiaryId) }),
  });
}

export function useMemberUpdateMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, input }: { userId: string; input: MemberUpdateInput }) =>
      apiFetch<{ member: MemberDto }>(`/api/apiaries/${enc(apiaryId)}/members/${enc(userId)}`, { method: 'PATCH', body: input }).then((r) => r.member),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: membersKey(apiaryId) });
      void qc.invalidateQueries({ queryKey: handoverKey(apiaryId) });
    },
  });
}

export function useMemberRemoveMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => apiFetch<void>(`/api/apiaries/${enc(apiaryId)}/members/${enc(userId)}`, { method: 'DELETE' }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: membersKey(apiaryId) }),
  });
}

export function useApiaryDeleteMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<void>(`/api/apiaries/${enc(apiaryId)}`, { method: 'DELETE' }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: apiaryKey(apiaryId) });
      void qc.invalidateQueries({ queryKey: apiariesKey() });
      void qc.invalidateQueries({ queryKey: meKey });
    },
  });
}

export function useHandoverQuery(apiaryId: string | undefined) {
  return useQuery({
    queryKey: handoverKey(apiaryId ?? ''),
    queryFn: ({ signal }) => apiFetch<{ handover: HandoverDto }>(`/api/apiaries/${enc(apiaryId ?? '')}/handover`, { signal }).then((r) => r.handover),
    enabled: Boolean(apiaryId),
    ...cacheLife.detail,
  });
}

export function useActivityQuery(apiaryId: string | undefined, enabled = true) {
  return useQuery({
    queryKey: activityKey(apiaryId ?? ''),
    queryFn: ({ signal }) => apiFetch<{ activity: ActivityDto[] }>(`/api/apiaries/${enc(apiaryId ?? '')}/activity?limit=30`, { signal }).then((r) => r.activity),
    enabled: Boolean(apiaryId) && enabled,
    ...cacheLife.list,
  });
}

export function useInvitationInfoQuery(token: string | undefined) {
  return useQuery({
    queryKey: invitationKey(token ?? ''),
    queryFn: ({ signal }) => apiFetch<{ invitation: InvitationInfoDto }>(`/api/invitations/${enc(token ?? '')}`, { signal }).then((r) => r.invitation),
    enabled: Boolean(token),
    retry: false,
    ...cacheLife.detail,
  });
}

/** Accepting changes who may be signed in and what they belong to: everything cached is reloaded. */
export function useInvitationAcceptMutation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (credentials: InvitationAcceptInput | undefined) =>
      apiFetch<{ user: UserDto; apiaryId: string; role: string }>(`/api/invitations/${enc(token)}/accept`, { method: 'POST', body: credentials ?? {} }),
    onSuccess: async () => {
      // Signing up here makes a new session: nothing of any earlier person may linger.
      qc.removeQueries();
      await qc.fetchQuery({ queryKey: meKey, queryFn: fetchMe, ...cacheLife.session });
    },
  });
}

export function usePasswordResetRequestMutation() {
  return useMutation({
    mutationFn: (email: string) => apiFetch<{ message: string }>('/api/auth/password-reset', { method: 'POST', body: { email } }),
  });
}

export function usePasswordResetMutation(token: string) {
  return useMutation({
    mutationFn: (password: string) => apiFetch<void>(`/api/auth/password-reset/${enc(token)}`, { method: 'POST', body: { password } }),
  });
}
