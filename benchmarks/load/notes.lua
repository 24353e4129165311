-- wrk script: POST notes to EventReview's API with bearer tokens, as pipelines do.
--
--   TARGETS=targets.txt wrk -t2 -c32 -d60s --latency -s benchmarks/load/notes.lua http://127.0.0.1:5300
--
-- targets.txt has one line per case: "<token> <case id> <item key>[,<item key>...]" (run.sh writes it after opening
-- one case per token). Each wrk thread takes every n-th case and posts to its cases in turn, each note to the case's
-- next item, so that 32 connections over 2 threads write to 32 cases. Statuses other than 201 are counted and printed.

local threads = {}
local counter = 0

function setup(thread)
  counter = counter + 1
  thread:set("index", counter)
  table.insert(threads, thread)
end

function init(args)
  local all = {}
  local file = assert(io.open(os.getenv("TARGETS") or "targets.txt", "r"))
  for line in file:lines() do
    local token, case, keys = line:match("^(%S+)%s+(%d+)%s+(%S+)$")
    if token then
      local items = {}
      for key in keys:gmatch("[^,]+") do table.insert(items, key) end
      table.insert(all, { token = token, case = case, items = items, next = 0 })
    end
  end
  file:close()
  local threadCount = tonumber(os.getenv("WRK_THREADS") or "2")
  mine = {}
  for i, target in ipairs(all) do
    if (i - 1) % threadCount == index - 1 then table.insert(mine, target) end
  end
  assert(#mine > 0, "no targets for thread " .. index)
  turn = 0
  sent = 0
  created = 0
  failed = {}
end

function request()
  turn = turn % #mine + 1
  local t = mine[turn]
  t.next = t.next + 1
  sent = sent + 1
  local key = t.items[(t.next - 1) % #t.items + 1]
  local body = string.format('{"text":"wrk note %d from thread %d: the *quick* check of `%s` found nothing unusual."}', sent, index, key)
  return wrk.format("POST", "/api/cases/" .. t.case .. "/items/" .. key .. "/notes",
    { ["Authorization"] = "Bearer " .. t.token, ["Content-Type"] = "application/json" }, body)
end

function response(status, headers, body)
  if status == 201 then
    created = created + 1
  else
    failed[status] = (failed[status] or 0) + 1
  end
end

function done(summary, latency, requests)
  local total = 0
  local errors = {}
  for _, thread in ipairs(threads) do
    total = total + thread:get("created")
    local f = thread:get("failed")
    for status, n in pairs(f) do errors[status] = (errors[status] or 0) + n end
  end
  io.write(string.format("wrk: %d notes acknowledged (201)\n", total))
  for status, n in pairs(errors) do io.write(string.format("wrk: status %s x%d\n", tostring(status), n)) end
  io.write(string.format("wrk: latency p50 %.1f ms, p90 %.1f ms, p99 %.1f ms, max %.1f ms\n",
    latency:percentile(50) / 1000, latency:percentile(90) / 1000, latency:percentile(99) / 1000, latency.max / 1000))
end
