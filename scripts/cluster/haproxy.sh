# HAProxy (Debian's haproxy) in front of the app processes. Source common.sh and galera.sh first.

# Writes $CLUSTER_DIR/run/haproxy.cfg: listen on 127.0.0.1:$1, balance over the app ports $2...
# Each process is checked every second on /api/health (200 when it reaches a ready database
# node); two failed checks take it out, two good ones bring it back. A connection a dead process
# refuses goes to another one (redispatch), a request it took and then dropped is answered 502.
# With no process up (no database node reachable), HAProxy answers 503 with Retry-After itself.
haproxy_config() {
  local port=$1; shift
  local run="$CLUSTER_DIR/run" i=0 p
  {
    printf 'HTTP/1.1 503 Service Unavailable\r\ncontent-type: application/problem+json\r\nretry-after: 5\r\ncache-control: no-store\r\nconnection: close\r\n\r\n'
    printf '{"error":"The service is not answering right now; nothing was changed. Try again in a moment."}\n'
  } >"$run/haproxy-503.http"
  {
    echo "global"
    echo "  maxconn 512"
    echo "defaults"
    echo "  mode http"
    echo "  timeout connect 2s"
    echo "  timeout client 60s"
    echo "  timeout server 60s"
    echo "  retries 2"
    echo "  option redispatch"
    echo "  errorfile 503 $run/haproxy-503.http"
    echo "frontend kerfline"
    echo "  bind 127.0.0.1:$port"
    echo "  option forwardfor"
    echo "  default_backend app"
    echo "backend app"
    echo "  balance leastconn"
    echo "  option httpchk GET /api/health"
    echo "  http-check expect status 200"
    echo "  default-server inter 1s fall 2 rise 2"
    for p in "$@"; do i=$((i + 1)); echo "  server app$i 127.0.0.1:$p check"; done
  } >"$run/haproxy.cfg"
  haproxy -c -q -f "$run/haproxy.cfg" || fail "HAProxy refused the generated configuration $run/haproxy.cfg"
}
