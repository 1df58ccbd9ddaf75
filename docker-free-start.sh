#!/usr/bin/env bash
# Sets up and runs Hoopline on this machine without Docker: installs what is missing (npm
# packages; Debian's mariadb-server), starts a private MariaDB and the local S3 and SMTP fakes
# with all state under .data/, migrates, seeds the demo (DEMO=true by default), builds, and
# serves on http://127.0.0.1:4321 with the reduction worker. Ctrl-C stops everything it started.
set -euo pipefail
cd "$(dirname "$0")"
ROOT=$(pwd)
mkdir -p .data
LOCK=.data/start.pid
HOST=${HOST:-127.0.0.1}
PORT=${PORT:-4321}

if [ -f "$LOCK" ] && kill -0 "$(cat "$LOCK")" 2>/dev/null; then
  echo "Hoopline is already running from this folder (start script pid $(cat "$LOCK")) at http://$HOST:$PORT."
  echo "Use that one, or stop it first (Ctrl-C in its terminal, or: kill $(cat "$LOCK"))."
  exit 1
fi
if (exec 3<>"/dev/tcp/$HOST/$PORT") 2>/dev/null; then
  echo "Port $PORT on $HOST is already taken by another program. Free it, or run with PORT=another-port $0."
  exit 1
fi
echo $$ > "$LOCK"

if [ -f .env ]; then set -a; . ./.env; set +a; fi
export ASTRO_TELEMETRY_DISABLED=1
export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED=true
export DEMO=${DEMO:-true}
export DEMO_PASSWORD=${DEMO_PASSWORD:-hoopline-demo}
export PUBLIC_BASE_URL=${PUBLIC_BASE_URL:-http://$HOST:$PORT}
export MAIL_DIR=${MAIL_DIR:-$ROOT/.data/mail}
if [ -z "${AUTH_SECRET:-}" ]; then
  [ -s .data/auth-secret ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))" > .data/auth-secret
  AUTH_SECRET=$(cat .data/auth-secret)
  export AUTH_SECRET
fi

pids=()
cleanup() {
  trap - INT TERM EXIT
  echo
  echo "Stopping Hoopline…"
  # app server and worker first (SIGTERM: the server finishes requests in flight and closes its
  # pool, the worker hands its job back), then the services they were using
  for ((i=${#pids[@]}-1; i>=1; i--)); do kill -TERM "${pids[$i]}" 2>/dev/null || true; done
  for ((i=${#pids[@]}-1; i>=1; i--)); do wait "${pids[$i]}" 2>/dev/null || true; done
  if [ ${#pids[@]} -gt 0 ]; then kill -TERM "${pids[0]}" 2>/dev/null || true; wait "${pids[0]}" 2>/dev/null || true; fi
  rm -f "$LOCK"
}
trap cleanup INT TERM EXIT

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages (npm ci)…"
  npm ci --no-audit --no-fund
fi

rm -f .data/services.state
node fake-services/run.mjs --data .data &
pids+=($!)
for _ in $(seq 1 600); do
  [ -f .data/services.state ] && break
  kill -0 "${pids[0]}" 2>/dev/null || { echo "The local services did not start; see the messages above."; exit 1; }
  sleep 0.1
done
[ -f .data/services.state ] || { echo "The local services did not come up within 60 s."; exit 1; }

npm run --silent db:migrate
npm run --silent db:seed
if [ "${SKIP_BUILD:-0}" != "1" ]; then
  echo "Building the app…"
  npm run --silent build > .data/build.log 2>&1 || { tail -30 .data/build.log; echo "Build failed (full log: .data/build.log)."; exit 1; }
fi

HOST=$HOST PORT=$PORT node scripts/serve.mjs > .data/server.log 2>&1 &
pids+=($!)
if [ -f src/server/jobs/worker-main.ts ]; then
  node --import tsx src/server/jobs/worker-main.ts > .data/worker.log 2>&1 &
  pids+=($!)
fi
for _ in $(seq 1 100); do
  curl -fs "http://$HOST:$PORT/api/health" >/dev/null 2>&1 && break
  sleep 0.2
done

cat <<INFO

  Hoopline is running at http://$HOST:$PORT
    database   MariaDB on 127.0.0.1:3407, data in .data/mariadb
    objects    S3 fake on http://127.0.0.1:4569, files in .data/s3
    mail       SMTP fake on 127.0.0.1:2526, messages in .data/mail (and the Outbox page)
    logs       .data/server.log, .data/worker.log
INFO
if [ "$DEMO" = "true" ] || [ "$DEMO" = "1" ]; then
cat <<INFO

  Demo accounts (password: $DEMO_PASSWORD)
    technician@example.com   engineer@example.com   qa@example.com   admin@example.com
  WARNING: these accounts and this password are for local demonstrations only.
           Never run demo mode on a machine others can reach.
INFO
fi
echo
echo "  Press Ctrl-C to stop."
wait "${pids[1]}"
