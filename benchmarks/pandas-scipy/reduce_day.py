#!/usr/bin/python3
"""The filter benchmark's comparison: a careful pandas + scipy script doing the job `bcprep process` does on the
17-column benchmark day (tools/SampleDay --wide), written to be timed beside it in benchmarks/whole-run.sh.

Same work, as far as a script of this size goes:
  read the CSV (all columns as float, ISO timestamps) -> calibrate (linear, Pt100 Callendar-Van Dusen inverse,
  type K ITS-90 with the cold-junction emf of the same row) -> detection series: bridge gaps up to 2 s, Hampel
  (10 samples each side, 6 sigma: the rig defaults), notches at 50, 100 and 150 Hz (Q 30) and 4th-order 0.5 Hz Butterworth low-pass,
  both forward-backward on second-order sections, 1 s block means -> steady windows on the key channels (5 min
  window in 10 s steps, straight-line change and scatter limits, 8 min minimum, last 5 min averaged) -> per window and
  channel: bridged, Hampel-filtered unfiltered samples, mean, standard deviation and the autocorrelation-corrected
  Type A (integrated autocorrelation time by FFT, Sokal's window) -> a summary CSV.
It does not propagate uncertainties, build profiles, hash inputs or write a manifest, which bcprep also does.

Usage: /usr/bin/python3 reduce_day.py LOG.csv OUT.csv
Versions (Debian 12 packages): printed with --versions; measured with Python 3.11.2, pandas 1.5.3, numpy 1.24.2,
scipy 1.10.1.
"""
import sys

import numpy as np
import pandas as pd
from scipy import signal

# Channel conversions of the sample rig (sample-logs/marten-rig.toml) and the wide shape's three extra thermocouples.
LINEAR = {  # column: (id, gain, offset, SI factor)
    "PBARO_V": ("p_baro", 60.0, 800.0, 100.0),
    "PT_IN_V": ("p_in", 500.0, 0.0, 1.0),
    "PT_OUT_V": ("p_out", 500.0, 0.0, 1.0),
    "FM_MA": ("mdot", 0.003125, -0.0125, 1.0),
    "HTR_V_SIG": ("heater_v", 25.0, 0.0, 1.0),
    "HTR_I_SIG": ("heater_i", 2.5, 0.0, 1.0),
}
THERMOCOUPLES = {"TC_IN_MV": "t_in", "TC_OUT_MV": "t_out", "TC_W1_MV": "t_w1", "TC_W2_MV": "t_w2",
                 "TC_W3_MV": "t_w3", "TC_W4_MV": "t_w4", "TC_L1_MV": "t_l1", "TC_L2_MV": "t_l2", "TC_L3_MV": "t_l3"}
KEYS = {"mdot": (0.0004, 0.0004, 0.005), "t_out": (0.3, 0.3, None), "t_w3": (0.4, 0.3, None)}  # change, scatter, min
BLOCK_S, WINDOW_S, STEP_S, MIN_DURATION_S, TAIL_S = 1.0, 300.0, 10.0, 480.0, 300.0
MAX_BRIDGE_S, HAMPEL_K, HAMPEL_SIGMAS = 2.0, 10, 6.0

# NIST Monograph 175, type K: direct function (t >= 0 degC, with the exponential term) and inverse pieces.
K_DIRECT_POS = [-0.176004136860E-01, 0.389212049750E-01, 0.185587700320E-04, -0.994575928740E-07, 0.318409457190E-09,
                -0.560728448890E-12, 0.560750590590E-15, -0.320207200030E-18, 0.971511471520E-22, -0.121047212750E-25]
K_EXP = (0.118597600000E+00, -0.118343200000E-03, 0.126968600000E+03)
K_INVERSE = [  # (emf upper limit mV, coefficients)
    (0.0, [0.0, 2.5173462E+01, -1.1662878E+00, -1.0833638E+00, -8.9773540E-01, -3.7342377E-01, -8.6632643E-02,
           -1.0450598E-02, -5.1920577E-04]),
    (20.644, [0.0, 2.508355E+01, 7.860106E-02, -2.503131E-01, 8.315270E-02, -1.228034E-02, 9.804036E-04,
              -4.413030E-05, 1.057734E-06, -1.052755E-08]),
    (54.886, [-1.318058E+02, 4.830222E+01, -1.646031E+00, 5.464731E-02, -9.650715E-04, 8.802193E-06, -3.110810E-08]),
]
CVD_A, CVD_B, R0 = 3.9083E-3, -5.775E-7, 100.0  # IEC 60751, t >= 0 degC


def k_emf_mv(t_c):
    return np.polyval(K_DIRECT_POS[::-1], t_c) + K_EXP[0] * np.exp(K_EXP[1] * (t_c - K_EXP[2]) ** 2)


def k_temperature_c(emf_mv):
    out = np.empty_like(emf_mv)
    lower = -np.inf
    for upper, coefficients in K_INVERSE:
        mask = (emf_mv > lower) & (emf_mv <= upper) if np.isfinite(lower) else emf_mv <= upper
        out[mask] = np.polyval(coefficients[::-1], emf_mv[mask])
        lower = upper
    out[emf_mv > K_INVERSE[-1][0]] = np.nan
    return out


def calibrate(raw):
    si = pd.DataFrame(index=raw.index)
    for column, (cid, gain, offset, factor) in LINEAR.items():
        si[cid] = (raw[column].to_numpy() * gain + offset) * factor
    r = raw["RTD_CJ_OHM"].to_numpy()
    t_cj_c = (-CVD_A + np.sqrt(CVD_A * CVD_A - 4 * CVD_B * (1 - r / R0))) / (2 * CVD_B)
    si["t_cj"] = t_cj_c + 273.15
    e_cj = k_emf_mv(t_cj_c)
    for column, cid in THERMOCOUPLES.items():
        if column in raw:
            si[cid] = k_temperature_c(raw[column].to_numpy() + e_cj) + 273.15
    return si


def bridge(values, fs):
    # Linear interpolation across gaps of at most MAX_BRIDGE_S; longer gaps stay NaN.
    return values.interpolate(limit=int(MAX_BRIDGE_S * fs), limit_area="inside")


def hampel(values):
    window = 2 * HAMPEL_K + 1
    median = values.rolling(window, center=True, min_periods=1).median()
    mad = (values - median).abs().rolling(window, center=True, min_periods=1).median()
    outlier = (values - median).abs() > HAMPEL_SIGMAS * 1.4826 * mad
    return values.where(~outlier, median)


def detection_series(si, fs):
    sos = [signal.iirnotch(50.0 * k, 30.0, fs) for k in (1, 2, 3) if 50.0 * k < fs / 2]
    sos = np.vstack([np.hstack([b, a]) for b, a in sos] + [signal.butter(4, 0.5, fs=fs, output="sos")])
    blocks = {}
    for cid in si.columns:
        x = hampel(bridge(si[cid], fs)).to_numpy()
        finite = np.isfinite(x)
        y = np.full_like(x, np.nan)
        if finite.all():
            y = signal.sosfiltfilt(sos, x)
        else:  # filter each gap-free run on its own
            edges = np.flatnonzero(np.diff(np.r_[0, finite.astype(np.int8), 0]))
            for start, end in zip(edges[::2], edges[1::2]):
                if end - start > 30:
                    y[start:end] = signal.sosfiltfilt(sos, x[start:end])
        blocks[cid] = y
    frame = pd.DataFrame(blocks, index=si.index)
    return frame.groupby((si.index // BLOCK_S).astype(np.int64)).mean()


def steady_windows(blocks):
    n_window, n_step = int(WINDOW_S / BLOCK_S), int(STEP_S / BLOCK_S)
    t = np.arange(n_window) * BLOCK_S
    steady = []
    for start in range(0, len(blocks) - n_window + 1, n_step):
        ok = True
        for cid, (change, scatter, minimum) in KEYS.items():
            y = blocks[cid].to_numpy()[start:start + n_window]
            if not np.isfinite(y).all():
                ok = False
                break
            slope = np.polyfit(t, y, 1)[0]
            if abs(slope) * WINDOW_S > change or y.std(ddof=1) > scatter or (minimum is not None and y.mean() < minimum):
                ok = False
                break
        steady.append((start, ok))
    windows, run_start, last = [], None, None
    for start, ok in steady + [(None, False)]:
        if ok and run_start is None:
            run_start = start
        if ok:
            last = start
        if not ok and run_start is not None:
            end = last + n_window
            if (end - run_start) * BLOCK_S >= MIN_DURATION_S:
                windows.append(((end * BLOCK_S) - TAIL_S, end * BLOCK_S))
            run_start = None
    return windows


def type_a(x):
    n = len(x)
    d = x - x.mean()
    size = 1 << (2 * n - 1).bit_length()
    f = np.fft.rfft(d, size)
    acf = np.fft.irfft(f * np.conj(f), size)[:n]
    acf /= acf[0]
    tau = 1.0
    for lag in range(1, n):
        tau += 2 * acf[lag]
        if lag >= 5 * tau:
            break
    return x.std(ddof=1) * np.sqrt(max(tau, 1.0) / n)


def main():
    if "--versions" in sys.argv:
        import scipy
        print(f"python {sys.version.split()[0]}, pandas {pd.__version__}, numpy {np.__version__}, scipy {scipy.__version__}")
        return
    log, out = sys.argv[1], sys.argv[2]
    raw = pd.read_csv(log, engine="c", float_precision="high")
    stamps = pd.to_datetime(raw.pop("timestamp"), format="%Y-%m-%dT%H:%M:%S.%f")
    raw.index = (stamps - stamps.iloc[0]).dt.total_seconds().to_numpy()
    fs = 1.0 / np.median(np.diff(raw.index.to_numpy()[:10000]))
    si = calibrate(raw)
    blocks = detection_series(si, fs)
    rows = []
    for number, (start, end) in enumerate(steady_windows(blocks), 1):
        window = si[(si.index >= start) & (si.index < end)]
        for cid in window.columns:
            x = hampel(bridge(window[cid], fs)).dropna().to_numpy()
            rows.append((f"OP{number}", start, end, cid, x.mean(), x.std(ddof=1), type_a(x)))
    pd.DataFrame(rows, columns=["point", "start [s]", "end [s]", "channel", "mean", "std", "u_A"]).to_csv(out, index=False)


if __name__ == "__main__":
    main()
