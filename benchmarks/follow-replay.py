#!/usr/bin/env python3
"""Replays a generated day into a log folder at SPEED times real time while `bcprep follow` follows it, and reports
whether follow keeps up and how much memory it holds.

Usage: benchmarks/follow-replay.py BCPREP RIG DAYDIR SPEED [--mark-hours H]
  BCPREP  the command to run (e.g. "dotnet /tmp/rel/bcprep.dll" or a published bcprep), quoted as one argument
  RIG     the rig file; DAYDIR the generated day (tools/SampleDay -- DIR --rate 2 --hours 24)

Each file of DAYDIR is written line by line into a fresh folder at the pace its timestamps give, divided by SPEED,
the next file started when one ends (as a logger rotates). follow runs with --json --interval 2; every report it
prints is stamped on arrival. The lag of a report is its arrival minus the moment the replay wrote the row it
reports on (time_s / SPEED after the start): follow keeps up when the lag stays near its 1 s poll and does not grow.
Peak RSS (VmHWM of the follow process, /proc) is read when the replay clock passes --mark-hours (default 2) and
when the logs end (before follow's final `process` run over the whole day, whose own peak is reported apart).
"""
import json, os, shlex, subprocess, sys, tempfile, threading, time
from datetime import datetime

def stamp(cell):
    try:
        return float(cell)
    except ValueError:
        return datetime.fromisoformat(cell).timestamp()

def main():
    command, rig, day, speed = sys.argv[1], sys.argv[2], sys.argv[3], float(sys.argv[4])
    mark_h = float(sys.argv[sys.argv.index("--mark-hours") + 1]) if "--mark-hours" in sys.argv else 2.0
    work = tempfile.mkdtemp(prefix="bcprep-follow-bench-")
    logs, out = os.path.join(work, "logs"), os.path.join(work, "out")
    os.mkdir(logs)
    files = sorted(os.path.join(day, f) for f in os.listdir(day) if f.endswith(".csv"))
    state = {"replay_t": 0.0, "replay_done": None, "start": None}

    def replay():
        t0 = None
        for path in files:
            with open(path) as src, open(os.path.join(logs, os.path.basename(path)), "w") as dst:
                dst.write(src.readline()); dst.flush()
                batch = []
                for line in src:
                    t = stamp(line.split(",", 1)[0])
                    if t0 is None:
                        t0 = t
                        state["start"] = time.time()
                    batch.append(line)
                    due = state["start"] + (t - t0) / speed
                    now = time.time()
                    if due > now or len(batch) >= 2000:
                        dst.write("".join(batch)); dst.flush(); batch = []
                        state["replay_t"] = t - t0
                        if due > now:
                            time.sleep(due - now)
                dst.write("".join(batch)); dst.flush()
        state["replay_done"] = time.time()

    follow = subprocess.Popen(shlex.split(command) + ["follow", rig, logs, "--out", out, "--json", "--interval", "2", "--end-after-idle", "4"],
                              stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True)
    writer = threading.Thread(target=replay); writer.start()
    marks = {}
    def hwm():
        try:
            with open(f"/proc/{follow.pid}/status") as s:
                for line in s:
                    if line.startswith("VmHWM:"):
                        return int(line.split()[1]) / 1024
        except OSError:
            return None
    events = []
    def read_err():
        for line in follow.stderr:
            events.append((time.time(), line.rstrip()))
            if line.startswith("end of the logs"):
                marks["end"] = hwm()
    err = threading.Thread(target=read_err); err.start()
    def sample():
        while follow.poll() is None:
            if "mark" not in marks and state["replay_t"] >= mark_h * 3600:
                marks["mark"] = hwm()
            last = hwm()
            if last is not None:
                marks["final"] = last
            time.sleep(0.2)
    sampler = threading.Thread(target=sample); sampler.start()
    lags = []
    for line in follow.stdout:
        arrived = time.time()
        report = json.loads(line)
        if report.get("event") == "report" and state["start"] is not None:
            lags.append((report["time_s"], arrived - (state["start"] + report["time_s"] / speed)))
    follow.wait(); writer.join(); err.join(); sampler.join()
    finished = [e for e in events if e[1].startswith("point finished")]
    reduced = [e for e in events if e[1].startswith("the day so far")]
    durations = [r[0] - f[0] for f, r in zip(finished, reduced)]
    late = [l for t, l in lags if t < lags[-1][0] * 0.98] if lags else []
    print(f"speed {speed:g}x: exit {follow.returncode}; {len(finished)} points finished, {len(reduced)} reductions "
          f"(median {sorted(durations)[len(durations) // 2] if durations else float('nan'):.2f} s, max {max(durations, default=float('nan')):.2f} s); "
          f"report lag median {sorted(late)[len(late) // 2] if late else float('nan'):.1f} s, max {max(late, default=float('nan')):.1f} s, "
          f"last quarter max {max((l for t, l in lags if t > lags[-1][0] * 0.75), default=float('nan')):.1f} s; "
          f"peak RSS at {mark_h:g} h {marks.get('mark', float('nan')):.0f} MB, at the end of the logs {marks.get('end', float('nan')):.0f} MB, "
          f"with the final process run {marks.get('final', float('nan')):.0f} MB")
    if follow.returncode != 0:
        print("\n".join(e[1] for e in events[-10:]), file=sys.stderr)

if __name__ == "__main__":
    main()
