# The payment service for scripts/start.sh (demo mode) and the throwaway test and bench stacks.
# Source common.sh first.

# Starts the local fake payment service on 127.0.0.1:$1 and points the app at it (PAYMENTS_API_URL,
# a fresh secret key and webhook secret for this run), unless PAYMENTS_SECRET_KEY is already set:
# then the app talks to the service PAYMENTS_API_URL names. Adds the fake's pid to $pids.
start_fake_payments_unless_configured() {
  if [ -n "${PAYMENTS_SECRET_KEY:-}" ]; then
    say "payments: the app talks to ${PAYMENTS_API_URL:-https://api.stripe.com} (PAYMENTS_SECRET_KEY is set)"
    return 0
  fi
  export PAYMENTS_FAKE_PORT=$1
  export PAYMENTS_API_URL="http://127.0.0.1:$PAYMENTS_FAKE_PORT"
  export PAYMENTS_SECRET_KEY="sk_test_fake_$(random_hex)"
  export PAYMENTS_WEBHOOK_SECRET="whsec_fake_$(random_hex)"
  node_modules/.bin/tsx scripts/payments/fake-payments.ts & pids+=($!)
  wait_http "$PAYMENTS_API_URL/_fake/health" 20 || { say "the fake payment service did not answer on $PAYMENTS_API_URL"; return 1; }
}

random_hex() {
  node -e "console.log(require('crypto').randomBytes(16).toString('hex'))"
}
