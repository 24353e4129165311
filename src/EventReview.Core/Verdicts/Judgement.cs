using System.Text.Json.Serialization;

namespace EventReview.Core.Verdicts;

/// <summary>
/// A check's verdict with its plain-language reason ("overlap 0.81 ≥ 0.5 and lag +3.1 ± 0.4 ms inside ±12.6 ms").
/// Every check kind's Core entry point returns one of these inside its result; the app stores and draws it and the CLI
/// prints it, neither judges again. In JSON it is <c>{"verdict": "&lt;stored word&gt;", "reason": "..."}</c>.
/// </summary>
/// <param name="Verdict">The typed verdict (written as its stored word).</param>
/// <param name="Reason">Why, with the numbers, their units and the tolerance they were judged against.</param>
public sealed record Judgement([property: JsonConverter(typeof(VerdictJsonConverter))] Verdict Verdict, string Reason)
{
    /// <summary>The stored word (<see cref="VerdictWords.Word"/>).</summary>
    [JsonIgnore]
    public string Word => VerdictWords.Word(Verdict);

    /// <summary>The tone it is drawn with.</summary>
    [JsonIgnore]
    public VerdictTone Tone => VerdictWords.Tone(Verdict);
}
