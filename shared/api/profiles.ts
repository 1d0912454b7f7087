/** One fixed version of an acceptance profile: the engine's parameters, defaults filled in. */
export interface ProfileVersionDto {
  id: number;
  profileId: number;
  version: number;
  /** The engine's profile (see shared/analysis/profile.ts), complete. */
  parameters: Record<string, unknown>;
  note: string;
  createdBy: string | null;
  createdAt: string;
  /** Whether any run used this version (it could never change anyway; this says it matters). */
  usedByRuns: number;
}

/** An acceptance profile with every version, newest first. */
export interface ProfileDto {
  id: number;
  name: string;
  description: string;
  latestVersionId: number;
  versions: ProfileVersionDto[];
  createdAt: string;
}

/** Body of `POST /api/profiles` (admin): a new profile with its first version. */
export interface CreateProfileRequest {
  name: string;
  description?: string;
  parameters: Record<string, unknown>;
  note?: string;
}

/** Body of `POST /api/profiles/:id/versions` (admin): editing a profile writes a new version. */
export interface CreateProfileVersionRequest {
  parameters: Record<string, unknown>;
  note?: string;
}
