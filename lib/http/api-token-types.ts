// Personal API tokens as the settings page and scripts see them. The secret appears only in the
// answer that made the token.
import type { TeamRole } from "@/lib/access/roles";

export interface ApiTokenItem {
  id: string;
  name: string;
  teamId: string;
  teamName: string;
  /** The most the token may do; the owner's current role in the team caps it further at each call. */
  role: TeamRole;
  /** The secret's first characters ("rft_AbCd"), to tell tokens apart. */
  prefix: string;
  createdAt: string;
  /** Updated at most once a minute. */
  lastUsedAt: string | null;
  expiresAt: string | null;
  revokedAt: string | null;
}

export interface ApiTokensResponse {
  tokens: ApiTokenItem[];
}

export interface ApiTokenCreatedResponse {
  token: ApiTokenItem;
  /** The whole secret, shown once: only its SHA-256 is kept. */
  secret: string;
}

export interface ApiTokenResponse {
  token: ApiTokenItem;
}
