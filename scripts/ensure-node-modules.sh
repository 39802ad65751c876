#!/usr/bin/env bash
# Installs npm packages when node_modules is missing or was installed from another lock file.
set -euo pipefail
cd "$(dirname "$0")/.."
stamp=node_modules/.plumbline-lock
if [ -f "$stamp" ] && cmp -s package-lock.json "$stamp"; then exit 0; fi
npm ci --no-audit --no-fund
cp package-lock.json "$stamp"
