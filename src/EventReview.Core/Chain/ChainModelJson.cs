using System.Numerics;
using System.Text.Json;
using EventReview.Core.Inputs;

namespace EventReview.Core.Chain;

/// <summary>
/// Reads a data-chain model file: <c>{"stages": [{"zerosHz": [[re, im], ..], "polesHz": [[re, im], ..], "gain": g,
/// "delaySeconds": 0, "prewarpHz": null, "expectedNoiseRms": null}]}</c>. zerosHz, polesHz, delaySeconds, prewarpHz and
/// expectedNoiseRms (the residual RMS expected when nothing is wrong, output units) may be omitted (empty, 0, null, null).
/// </summary>
public static class ChainModelJson
{
    /// <summary>Parses and validates every stage.</summary>
    /// <exception cref="FormatException">Malformed JSON, a missing gain, a root that is not a [re, im] pair, or an
    /// invalid stage (unstable pole, unpaired complex root...); the message names the stage.</exception>
    public static IReadOnlyList<ChainStageModel> Parse(string json)
    {
        ArgumentNullException.ThrowIfNull(json);
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(json);
        }
        catch (JsonException ex)
        {
            throw new FormatException($"model is not valid JSON: {ex.Message}");
        }

        using (doc)
        {
            if (doc.RootElement.ValueKind != JsonValueKind.Object || !doc.RootElement.TryGetProperty("stages", out var stages) || stages.ValueKind != JsonValueKind.Array || stages.GetArrayLength() == 0)
            {
                throw new FormatException("model must be an object with a non-empty \"stages\" array");
            }

            var list = new List<ChainStageModel>();
            var n = 0;
            foreach (var s in stages.EnumerateArray())
            {
                n++;
                if (s.ValueKind != JsonValueKind.Object)
                {
                    throw new FormatException($"stage {n}: must be an object");
                }

                var zeros = Roots(s, "zerosHz", n);
                var poles = Roots(s, "polesHz", n);
                var gain = Number(s, "gain", n) ?? throw new FormatException($"stage {n}: \"gain\" is required");
                var delay = Number(s, "delaySeconds", n) ?? 0;
                var prewarp = Number(s, "prewarpHz", n);
                var model = new ChainStageModel(zeros, poles, gain, delay, prewarp, Number(s, "expectedNoiseRms", n));
                try
                {
                    model.Validate(n);
                }
                catch (ArgumentException ex)
                {
                    throw new FormatException(UserMessage.From(ex));
                }

                list.Add(model);
            }

            return list;
        }
    }

    private static double? Number(JsonElement s, string name, int n)
    {
        if (!s.TryGetProperty(name, out var v) || v.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        return v.ValueKind == JsonValueKind.Number ? v.GetDouble() : throw new FormatException($"stage {n}: \"{name}\" must be a number");
    }

    private static List<Complex> Roots(JsonElement s, string name, int n)
    {
        var list = new List<Complex>();
        if (!s.TryGetProperty(name, out var arr) || arr.ValueKind == JsonValueKind.Null)
        {
            return list;
        }

        if (arr.ValueKind != JsonValueKind.Array)
        {
            throw new FormatException($"stage {n}: \"{name}\" must be an array of [re, im] pairs");
        }

        foreach (var r in arr.EnumerateArray())
        {
            if (r.ValueKind != JsonValueKind.Array || r.GetArrayLength() != 2 || r.EnumerateArray().Any(e => e.ValueKind != JsonValueKind.Number))
            {
                throw new FormatException($"stage {n}: \"{name}\" entry {list.Count + 1} must be a [re, im] pair of numbers");
            }

            list.Add(new Complex(r[0].GetDouble(), r[1].GetDouble()));
        }

        return list;
    }
}
