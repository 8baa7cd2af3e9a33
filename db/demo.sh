#!/usr/bin/env bash
# One command from a fresh machine to the running demo at http://127.0.0.1:3000:
# installs npm packages, starts the local PostgreSQL (installing Debian's package when missing),
# migrates, seeds the demo studio when the database is empty, builds and serves the app.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  npm ci --no-audit --no-fund
fi

bash db/setup.sh start
node --import tsx ./node_modules/knex/bin/cli.js --knexfile knexfile.ts migrate:latest

# Seed only an empty database, so work saved in the demo survives a restart (`npm run db:seed` resets it).
if [ "$(node --import tsx db/has-data.ts)" = "empty" ]; then
  node --import tsx ./node_modules/knex/bin/cli.js --knexfile knexfile.ts seed:run
fi

# A session secret of this machine's own (production refuses the development default).
mkdir -p .data
[ -s .data/session-secret ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))" > .data/session-secret
export SESSION_SECRET="$(cat .data/session-secret)"
export NEEDLEMAP_DEV_PAGES=true

# The local S3 and SMTP fakes, in the background; they stop when this process (the app server
# after the exec below) ends. Files go to .data/s3, caught e-mails to .data/mail (see /dev/mail).
S3_PORT="${NEEDLEMAP_S3_PORT:-4569}"
SMTP_PORT_LOCAL="${NEEDLEMAP_SMTP_PORT:-2525}"
node --import tsx tests/fakes/start.ts --s3-port "$S3_PORT" --smtp-port "$SMTP_PORT_LOCAL" \
  --s3-dir .data/s3 --mail-dir .data/mail --parent-pid $$ > .data/fakes.log 2>&1 &
for _ in $(seq 1 60); do grep -q '"smtpPort"' .data/fakes.log 2>/dev/null && break; sleep 0.5; done
grep -q '"smtpPort"' .data/fakes.log || { echo "The local S3/SMTP fakes did not start:" >&2; cat .data/fakes.log >&2; exit 1; }
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT" S3_BUCKET=needlemap-files S3_REGION=us-east-1 S3_FORCE_PATH_STYLE=true
export S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER
export SMTP_HOST=127.0.0.1 SMTP_PORT="$SMTP_PORT_LOCAL" SMTP_IGNORE_TLS=true NEEDLEMAP_MAIL_DIR="$PWD/.data/mail"
export APP_URL="${APP_URL:-http://127.0.0.1:${PORT:-3000}}"

npx next build
echo
echo "Needlemap is starting at http://127.0.0.1:3000  (demo accounts: see README.md)"
exec node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "${PORT:-3000}"
