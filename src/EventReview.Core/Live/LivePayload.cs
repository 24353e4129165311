using System.Text;
using System.Text.Json;
using EventReview.Core.Inputs;

namespace EventReview.Core.Live;

/// <summary>
/// The text of a live message on the wire (PostgreSQL <c>NOTIFY</c> payload), small JSON of format version 1:
/// <c>{"v":1,"o":origin,"t":"change","case":id,"seq":n}</c> for a committed change (ids only), and
/// <c>{"v":1,"o":origin,"t":"here","case":id,"s":session,"u":user,"n":name,"i":item,"d":doing,"bye":true}</c> for a
/// presence beat. Reading never throws: a payload that is not such JSON, too long, of another version or with a field
/// missing or out of range comes back as <see cref="LiveMessage.Refused"/> with the reason.
/// </summary>
public static class LivePayload
{
    /// <summary>Format version written and read.</summary>
    public const int Version = 1;

    /// <summary>Longest payload in UTF-8 bytes (PostgreSQL refuses a NOTIFY payload of 8,000 bytes or more).</summary>
    public const int MaxBytes = 7_999;

    /// <summary>Longest "doing" text, characters.</summary>
    public const int MaxDoingLength = 60;

    /// <summary>Longest origin, session or account id, characters.</summary>
    public const int MaxIdLength = 64;

    /// <summary>Longest item key, characters.</summary>
    public const int MaxItemKeyLength = 128;

    /// <summary>The payload of a committed change.</summary>
    public static string Format(string origin, CaseChanged change)
    {
        ArgumentNullException.ThrowIfNull(change);
        return Write(w =>
        {
            w.WriteNumber("v", Version);
            w.WriteString("o", origin);
            w.WriteString("t", "change");
            w.WriteString("case", change.CandidateId);
            w.WriteNumber("seq", change.Sequence);
        });
    }

    /// <summary>The payload of a presence beat (the display name is cut to <see cref="InputLimits.MaxNameLength"/>).</summary>
    public static string Format(string origin, PresenceBeat beat)
    {
        ArgumentNullException.ThrowIfNull(beat);
        return Write(w =>
        {
            w.WriteNumber("v", Version);
            w.WriteString("o", origin);
            w.WriteString("t", "here");
            w.WriteString("case", beat.CandidateId);
            w.WriteString("s", beat.SessionId);
            w.WriteString("u", beat.UserId);
            w.WriteString("n", Cut(beat.DisplayName, InputLimits.MaxNameLength));
            if (beat.ItemKey is not null)
            {
                w.WriteString("i", beat.ItemKey);
            }

            if (beat.Doing is not null)
            {
                w.WriteString("d", Cut(beat.Doing, MaxDoingLength));
            }

            if (beat.Leaving)
            {
                w.WriteBoolean("bye", true);
            }
        });
    }

    /// <summary>Reads a payload; never throws (see the class remarks).</summary>
    public static LiveMessage Parse(string? text)
    {
        if (string.IsNullOrEmpty(text))
        {
            return LiveMessage.Refused("empty payload");
        }

        if (Encoding.UTF8.GetByteCount(text) > MaxBytes)
        {
            return LiveMessage.Refused($"payload longer than {MaxBytes} bytes");
        }

        try
        {
            using var doc = JsonDocument.Parse(text);
            var root = doc.RootElement;
            if (root.ValueKind != JsonValueKind.Object)
            {
                return LiveMessage.Refused("payload is not a JSON object");
            }

            if (!root.TryGetProperty("v", out var v) || v.ValueKind != JsonValueKind.Number || !v.TryGetInt32(out var version) || version != Version)
            {
                return LiveMessage.Refused($"payload is not of format version {Version}");
            }

            var origin = Text(root, "o", MaxIdLength);
            var candidate = Text(root, "case", InputLimits.MaxCandidateIdLength);
            if (origin is null || candidate is null)
            {
                return LiveMessage.Refused("payload lacks its origin or case, or one is too long");
            }

            return Text(root, "t", 10) switch
            {
                "change" => ReadChange(root, origin, candidate),
                "here" => ReadPresence(root, origin, candidate),
                _ => LiveMessage.Refused("payload of an unknown type (expected \"change\" or \"here\")"),
            };
        }
        catch (JsonException ex)
        {
            return LiveMessage.Refused($"payload is not JSON ({ex.Message})");
        }
    }

    private static LiveMessage ReadChange(JsonElement root, string origin, string candidate)
    {
        if (!root.TryGetProperty("seq", out var seq) || seq.ValueKind != JsonValueKind.Number || !seq.TryGetInt32(out var sequence) || sequence < 1)
        {
            return LiveMessage.Refused("change without a sequence number of 1 or more");
        }

        return new LiveMessage(origin, new CaseChanged(candidate, sequence), null, null);
    }

    private static LiveMessage ReadPresence(JsonElement root, string origin, string candidate)
    {
        var session = Text(root, "s", MaxIdLength);
        var user = Text(root, "u", MaxIdLength);
        var name = Text(root, "n", InputLimits.MaxNameLength);
        if (session is null || user is null || name is null)
        {
            return LiveMessage.Refused("presence without its session, account or name, or one is too long");
        }

        var item = Optional(root, "i", MaxItemKeyLength, out var itemOk);
        var doing = Optional(root, "d", MaxDoingLength, out var doingOk);
        if (!itemOk || !doingOk)
        {
            return LiveMessage.Refused("presence with an item or activity that is not text or too long");
        }

        var leaving = root.TryGetProperty("bye", out var bye) && bye.ValueKind == JsonValueKind.True;
        return new LiveMessage(origin, null, new PresenceBeat(candidate, session, user, name, item, doing, leaving), null);
    }

    /// <summary>A required non-blank string property of at most <paramref name="max"/> characters, or null.</summary>
    private static string? Text(JsonElement root, string name, int max) =>
        root.TryGetProperty(name, out var p) && p.ValueKind == JsonValueKind.String && p.GetString() is { Length: > 0 } s && s.Length <= max && !string.IsNullOrWhiteSpace(s)
            ? s
            : null;

    private static string? Optional(JsonElement root, string name, int max, out bool ok)
    {
        ok = true;
        if (!root.TryGetProperty(name, out var p) || p.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        var s = Text(root, name, max);
        ok = s is not null;
        return s;
    }

    private static string Cut(string text, int max) => text.Length <= max ? text : text[..max];

    private static string Write(Action<Utf8JsonWriter> body)
    {
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer))
        {
            w.WriteStartObject();
            body(w);
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray());
    }
}
