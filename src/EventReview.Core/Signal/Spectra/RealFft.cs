using System.Collections.Concurrent;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace EventReview.Core.Signal.Spectra;

/// <summary>
/// Forward and inverse discrete Fourier transform of real data of a power-of-two length n, via a complex radix-2 FFT of
/// length n/2. Forward: X[k] = Σ x[j] e^{−2πijk/n} for k = 0..n/2 (no scaling, the "NoScaling" convention).
/// Inverse: x[j] = (1/n) Σ X[k] e^{+2πijk/n} using Hermitian symmetry. Results agree with MathNet.Numerics
/// Fourier.ForwardReal/InverseReal (tested as the oracle); this plan-based version is used on hot paths because it
/// precomputes twiddles and avoids per-call allocation. Plans are cached per length and are thread-safe to use.
/// </summary>
// Cooley and Tukey, Math. Comp. 19 (1965) 297; real-input split: Press et al., "Numerical Recipes", 3rd ed., section 12.3.
public sealed class RealFft
{
    private static readonly ConcurrentDictionary<int, RealFft> Plans = new();
    private readonly int _n;
    private readonly int _m;
    private readonly int[] _bitReverse;
    private readonly double[] _cosM;
    private readonly double[] _sinM;
    private readonly double[] _cosN;
    private readonly double[] _sinN;

    private RealFft(int n)
    {
        _n = n;
        _m = n / 2;
        int bits = 0;
        while ((1 << bits) < _m)
        {
            bits++;
        }

        _bitReverse = new int[_m];
        for (int i = 0; i < _m; i++)
        {
            int r = 0;
            for (int b = 0; b < bits; b++)
            {
                r |= ((i >> b) & 1) << (bits - 1 - b);
            }

            _bitReverse[i] = r;
        }

        _cosM = new double[Math.Max(1, _m / 2)];
        _sinM = new double[Math.Max(1, _m / 2)];
        for (int k = 0; k < _m / 2; k++)
        {
            _cosM[k] = Math.Cos(2 * Math.PI * k / _m);
            _sinM[k] = -Math.Sin(2 * Math.PI * k / _m);
        }

        _cosN = new double[_m + 1];
        _sinN = new double[_m + 1];
        for (int k = 0; k <= _m; k++)
        {
            _cosN[k] = Math.Cos(2 * Math.PI * k / n);
            _sinN[k] = -Math.Sin(2 * Math.PI * k / n);
        }
    }

    /// <summary>Transform length n (a power of two, at least 4).</summary>
    public int Length => _n;

    /// <summary>Number of one-sided bins, n/2 + 1.</summary>
    public int Bins => _m + 1;

    /// <summary>The cached plan for length <paramref name="n"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When n is not a power of two of at least 4.</exception>
    public static RealFft For(int n)
    {
        if (n < 4 || (n & (n - 1)) != 0)
        {
            throw new ArgumentOutOfRangeException(nameof(n), n, "FFT length must be a power of two of at least 4.");
        }

        return Plans.GetOrAdd(n, static k => new RealFft(k));
    }

    /// <summary>Smallest power of two ≥ <paramref name="n"/> (and ≥ 4).</summary>
    public static int NextPowerOfTwo(int n)
    {
        int p = 4;
        while (p < n)
        {
            p <<= 1;
        }

        return p;
    }

    /// <summary>Forward transform of n real samples into n/2 + 1 bins (real and imaginary parts), unscaled.</summary>
    public void Forward(ReadOnlySpan<double> input, Span<double> re, Span<double> im)
    {
        if (input.Length != _n || re.Length < _m + 1 || im.Length < _m + 1)
        {
            throw new ArgumentException($"Forward FFT needs {_n} inputs and {_m + 1} output bins.", nameof(input));
        }

        for (int k = 0; k < _m; k++)
        {
            int r = _bitReverse[k];
            re[r] = input[2 * k];
            im[r] = input[(2 * k) + 1];
        }

        Butterflies(re, im);
        double z0r = re[0], z0i = im[0];
        for (int k = 1; k < (_m / 2) + 1; k++)
        {
            int j = _m - k;
            double ar = re[k], ai = im[k], br = re[j], bi = im[j];
            // Fe = (Z[k] + conj Z[m-k]) / 2; Fo = -i (Z[k] - conj Z[m-k]) / 2
            double fer = 0.5 * (ar + br), fei = 0.5 * (ai - bi);
            double for_ = 0.5 * (ai + bi), foi = -0.5 * (ar - br);
            double wr = _cosN[k], wi = _sinN[k];
            double tr = (wr * for_) - (wi * foi), ti = (wr * foi) + (wi * for_);
            // X[m-k] from the mirrored pair: Fe' = conj Fe, Fo' = conj Fo, W^{m-k} = -conj W^k
            double fer2 = fer, fei2 = -fei, for2 = for_, foi2 = -foi;
            double wr2 = _cosN[j], wi2 = _sinN[j];
            double tr2 = (wr2 * for2) - (wi2 * foi2), ti2 = (wr2 * foi2) + (wi2 * for2);
            re[k] = fer + tr;
            im[k] = fei + ti;
            re[j] = fer2 + tr2;
            im[j] = fei2 + ti2;
        }

        re[0] = z0r + z0i;
        im[0] = 0;
        re[_m] = z0r - z0i;
        im[_m] = 0;
    }

    /// <summary>Inverse transform of n/2 + 1 one-sided bins into n real samples, scaled by 1/n (imaginary parts of DC and Nyquist ignored).</summary>
    /// <remarks>The input bins are overwritten (used as work space).</remarks>
    public void Inverse(Span<double> re, Span<double> im, Span<double> output)
    {
        if (output.Length != _n || re.Length < _m + 1 || im.Length < _m + 1)
        {
            throw new ArgumentException($"Inverse FFT needs {_m + 1} bins and {_n} outputs.", nameof(output));
        }

        double x0 = re[0], xm = re[_m];
        for (int k = 1; k < (_m / 2) + 1; k++)
        {
            int j = _m - k;
            double ar = re[k], ai = im[k], br = re[j], bi = im[j];
            // Fe = (X[k] + conj X[m-k]) / 2; Fo = (X[k] - conj X[m-k]) conj(W^k) / 2; Z = Fe + i Fo
            double fer = 0.5 * (ar + br), fei = 0.5 * (ai - bi);
            double dr = 0.5 * (ar - br), di = 0.5 * (ai + bi);
            double wr = _cosN[k], wi = -_sinN[k];
            double for_ = (dr * wr) - (di * wi), foi = (dr * wi) + (di * wr);
            // mirrored: Fe' = conj Fe, D' = -conj D, W' = conj W^{m-k}
            double dr2 = -dr, di2 = di;
            double wr2 = _cosN[j], wi2 = -_sinN[j];
            double for2 = (dr2 * wr2) - (di2 * wi2), foi2 = (dr2 * wi2) + (di2 * wr2);
            re[k] = fer - foi;
            im[k] = fei + for_;
            re[j] = fer - foi2;
            im[j] = -fei + for2;
        }

        re[0] = 0.5 * (x0 + xm);
        im[0] = 0.5 * (x0 - xm);
        // Inverse complex FFT as conj(FFT(conj Z)).
        for (int k = 0; k < _m; k++)
        {
            im[k] = -im[k];
        }

        Permute(re, im);
        Butterflies(re, im);
        double scale = 1.0 / _m;
        for (int k = 0; k < _m; k++)
        {
            output[2 * k] = re[k] * scale;
            output[(2 * k) + 1] = -im[k] * scale;
        }
    }

    private void Permute(Span<double> re, Span<double> im)
    {
        for (int i = 0; i < _m; i++)
        {
            int r = _bitReverse[i];
            if (r > i)
            {
                (re[i], re[r]) = (re[r], re[i]);
                (im[i], im[r]) = (im[r], im[i]);
            }
        }
    }

    // Radix-2 decimation in time on bit-reversed input; the first two stages use their trivial twiddles (1 and −i).
    // Element access through refs avoids bounds checks in the hot loops (indices are in range by construction).
    private void Butterflies(Span<double> re, Span<double> im)
    {
        int m = _m;
        ref double r = ref MemoryMarshal.GetReference(re);
        ref double q = ref MemoryMarshal.GetReference(im);
        for (int a = 0; a < m; a += 2)
        {
            double tr = Unsafe.Add(ref r, a + 1), ti = Unsafe.Add(ref q, a + 1);
            double ur = Unsafe.Add(ref r, a), ui = Unsafe.Add(ref q, a);
            Unsafe.Add(ref r, a + 1) = ur - tr;
            Unsafe.Add(ref q, a + 1) = ui - ti;
            Unsafe.Add(ref r, a) = ur + tr;
            Unsafe.Add(ref q, a) = ui + ti;
        }

        if (m >= 4)
        {
            for (int a = 0; a < m; a += 4)
            {
                double x0r = Unsafe.Add(ref r, a), x0i = Unsafe.Add(ref q, a);
                double x1r = Unsafe.Add(ref r, a + 1), x1i = Unsafe.Add(ref q, a + 1);
                double x2r = Unsafe.Add(ref r, a + 2), x2i = Unsafe.Add(ref q, a + 2);
                double x3r = Unsafe.Add(ref r, a + 3), x3i = Unsafe.Add(ref q, a + 3);
                // twiddle −i on x3: (x3r, x3i)·(−i) = (x3i, −x3r)
                double t3r = x3i, t3i = -x3r;
                Unsafe.Add(ref r, a) = x0r + x2r;
                Unsafe.Add(ref q, a) = x0i + x2i;
                Unsafe.Add(ref r, a + 2) = x0r - x2r;
                Unsafe.Add(ref q, a + 2) = x0i - x2i;
                Unsafe.Add(ref r, a + 1) = x1r + t3r;
                Unsafe.Add(ref q, a + 1) = x1i + t3i;
                Unsafe.Add(ref r, a + 3) = x1r - t3r;
                Unsafe.Add(ref q, a + 3) = x1i - t3i;
            }
        }

        ref double cw = ref MemoryMarshal.GetArrayDataReference(_cosM);
        ref double sw = ref MemoryMarshal.GetArrayDataReference(_sinM);
        int size = 8;
        while (size <= m)
        {
            if (2 * size <= m)
            {
                TwoStages(ref r, ref q, ref cw, ref sw, m, size);
                size <<= 2;
            }
            else
            {
                OneStage(ref r, ref q, ref cw, ref sw, m, size);
                size <<= 1;
            }
        }
    }

    private static void OneStage(ref double r, ref double q, ref double cw, ref double sw, int m, int size)
    {
        int half = size >> 1;
        int stride = m / size;
        for (int start = 0; start < m; start += size)
        {
            for (int j = 0, t = 0; j < half; j++, t += stride)
            {
                double wr = Unsafe.Add(ref cw, t), wi = Unsafe.Add(ref sw, t);
                int a = start + j, b = a + half;
                double xr = Unsafe.Add(ref r, b), xi = Unsafe.Add(ref q, b);
                double tr = (wr * xr) - (wi * xi), ti = (wr * xi) + (wi * xr);
                double ur = Unsafe.Add(ref r, a), ui = Unsafe.Add(ref q, a);
                Unsafe.Add(ref r, b) = ur - tr;
                Unsafe.Add(ref q, b) = ui - ti;
                Unsafe.Add(ref r, a) = ur + tr;
                Unsafe.Add(ref q, a) = ui + ti;
            }
        }
    }

    // Stages of span `size` and `2 size` fused in one pass over memory (radix-2 squared): the second stage's odd twiddle is
    // the even one times −i.
    private static void TwoStages(ref double r, ref double q, ref double cw, ref double sw, int m, int size)
    {
        int h = size >> 1;
        int stride1 = m / size, stride2 = m / (2 * size);
        for (int start = 0; start < m; start += 4 * h)
        {
            for (int j = 0; j < h; j++)
            {
                double w1r = Unsafe.Add(ref cw, j * stride1), w1i = Unsafe.Add(ref sw, j * stride1);
                double w2r = Unsafe.Add(ref cw, j * stride2), w2i = Unsafe.Add(ref sw, j * stride2);
                int i0 = start + j, i1 = i0 + h, i2 = i1 + h, i3 = i2 + h;
                double x0r = Unsafe.Add(ref r, i0), x0i = Unsafe.Add(ref q, i0);
                double x1r = Unsafe.Add(ref r, i1), x1i = Unsafe.Add(ref q, i1);
                double x2r = Unsafe.Add(ref r, i2), x2i = Unsafe.Add(ref q, i2);
                double x3r = Unsafe.Add(ref r, i3), x3i = Unsafe.Add(ref q, i3);
                double tr = (w1r * x1r) - (w1i * x1i), ti = (w1r * x1i) + (w1i * x1r);
                double y0r = x0r + tr, y0i = x0i + ti, y1r = x0r - tr, y1i = x0i - ti;
                tr = (w1r * x3r) - (w1i * x3i);
                ti = (w1r * x3i) + (w1i * x3r);
                double y2r = x2r + tr, y2i = x2i + ti, y3r = x2r - tr, y3i = x2i - ti;
                double ur = (w2r * y2r) - (w2i * y2i), ui = (w2r * y2i) + (w2i * y2r);
                // (w2 · −i) · y3 = −i (w2 y3)
                double pr = (w2r * y3r) - (w2i * y3i), pi = (w2r * y3i) + (w2i * y3r);
                double vr = pi, vi = -pr;
                Unsafe.Add(ref r, i0) = y0r + ur;
                Unsafe.Add(ref q, i0) = y0i + ui;
                Unsafe.Add(ref r, i2) = y0r - ur;
                Unsafe.Add(ref q, i2) = y0i - ui;
                Unsafe.Add(ref r, i1) = y1r + vr;
                Unsafe.Add(ref q, i1) = y1i + vi;
                Unsafe.Add(ref r, i3) = y1r - vr;
                Unsafe.Add(ref q, i3) = y1i - vi;
            }
        }
    }
}
