using System.Text.Json.Serialization;

namespace EventReview.Core.Verdicts;

/// <summary>
/// A check's verdict with its plain-language reason ("overlap 0.81 ≥ 0.5 and lag +3.1 ± 0.4 ms inside ±12.6 ms").
/// Every check kind's Core entry point returns one of these inside its result; the app stores and draws it and the CLI
/// prints it, neither judges again. In JSON it is <c>{"verdict": "&lt;stored word&gt;", "reason": "..."}</c>.
/// </summary>
/// <param name="Verdict">The typed verdict (written as its stored word).</param>
/// <param name="Reason">Why, with the numbers, their units and the tolerance they were judged against.</param>
[JsonConverter(typeof(JudgementJson))]
public sealed record Judgement(Verdict Verdict, string Reason)
{
    /// <summary>The stored word (<see cref="VerdictWords.Word"/>).</summary>
    [JsonIgnore]
    public string Word => VerdictWords.Word(Verdict);

    /// <summary>The tone it is drawn with.</summary>
    [JsonIgnore]
    public VerdictTone Tone => VerdictWords.Tone(Verdict);

    /// <summary>The worst of several judgements by tone (bad, then attention, then neutral, then good), the first on a tie; null for none.</summary>
    public static Judgement? Worst(IEnumerable<Judgement> judgements)
    {
        ArgumentNullException.ThrowIfNull(judgements);
        Judgement? worst = null;
        foreach (var j in judgements)
        {
            if (worst is null || Rank(j.Tone) > Rank(worst.Tone))
            {
                worst = j;
            }
        }

        return worst;
    }

    private static int Rank(VerdictTone tone) => tone switch
    {
        VerdictTone.Bad => 3,
        VerdictTone.Attention => 2,
        VerdictTone.Neutral => 1,
        _ => 0,
    };
}
