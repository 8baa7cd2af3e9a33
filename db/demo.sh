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

npx next build
echo
echo "Needlemap is starting at http://127.0.0.1:3000  (demo accounts: see README.md)"
exec node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "${PORT:-3000}"
