import { RESUMABLE_UPLOAD_PATH } from '@shared/api';

/** What the recipe has in place of the token, which the shift lead pastes in. */
export const UPLOAD_TOKEN_PLACEHOLDER = '<upload token>';

/**
 * A bash script for the acquisition computer: it sends one round log to the setup by the tus 1.0
 * protocol with curl, going on where the link broke off, and prints the run's JSON. When the
 * last answer was lost, the upload is gone from HEAD and GET tells which run it made.
 */
export function acquisitionRecipe(origin: string, setupId: number): string {
  return `#!/usr/bin/env bash
# Sends one round log to Bellkeep, setup ${setupId}, resumably:  bash send-log.sh night.csv.gz
# Needs curl 7.76 or later and GNU coreutils; the token is shown once, when it is made.
FILE="$1"; UPLOADS='${origin}${RESUMABLE_UPLOAD_PATH}'
AUTH='Authorization: Bearer ${UPLOAD_TOKEN_PLACEHOLDER}'; TUS='Tus-Resumable: 1.0.0'
META="filename $(basename "$FILE" | tr -d '\\n' | base64 -w0),setupId $(printf ${setupId} | base64)"
# Create the upload; its address comes back in the Location header (a refusal is printed).
CREATED=$(curl -s --fail-with-body -X POST "$UPLOADS" -H "$AUTH" -H "$TUS" -H "Upload-Length: $(stat -c %s "$FILE")" \\
  -H "Upload-Metadata: $META" -D - | tr -d '\\r')
LOCATION=$(sed -n 's/^location: *//Ip' <<<"$CREATED"); [ -n "$LOCATION" ] || { echo "$CREATED" >&2; exit 1; }
URL="$UPLOADS/\${LOCATION##*/}"
while true; do
  # How many bytes are in? No answer: GET prints the run if the upload finished, 404 if it is gone.
  OFFSET=$(curl -sfI "$URL" -H "$AUTH" -H "$TUS" | tr -d '\\r' | sed -n 's/^upload-offset: *//Ip')
  if [ -z "$OFFSET" ]; then curl -s --fail-with-body "$URL" -H "$AUTH"; case $? in 0) break ;; 22) exit 1 ;; esac
  # Send the rest; the last PATCH answers with the run's JSON.
  elif tail -c +$((OFFSET + 1)) "$FILE" | curl -s --fail-with-body -X PATCH "$URL" -H "$AUTH" -H "$TUS" \\
    -H 'Content-Type: application/offset+octet-stream' -H "Upload-Offset: $OFFSET" -T -; then break; fi
  sleep 10 # the link broke off: ask again, then go on from there
done
echo
`;
}
