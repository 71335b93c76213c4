#!/usr/bin/env bash
# The whole test pass: types, build, unit, integration on PGlite, the same integration suite
# on a real PostgreSQL server, the cluster suite (two app processes on one PostgreSQL server and
# a fake S3 bucket), then the browser tests.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1

echo "── lint (types, ESLint, knip)"; npm run -s lint
echo "── build";                npm run -s build
echo "── unit";                 npm run -s test:unit
echo "── crash safety";         npm run -s test:crash
echo "── integration (PGlite)"; npm run -s test:integration
echo "── integration (PostgreSQL)"; bash scripts/with-postgres.sh npm run -s test:integration
echo "── cluster (two processes, PostgreSQL, fake S3; a ten-minute soak)"; CLUSTER_SOAK_SECONDS="${CLUSTER_SOAK_SECONDS:-600}" npm run -s test:cluster
echo "── e2e (Chromium)";       npm run -s test:e2e
