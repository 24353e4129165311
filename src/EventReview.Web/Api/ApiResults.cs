using System.Text.Json;
using EventReview.Core.Cases;
using EventReview.Data;
using EventReview.Web.Services;
using EventReview.Core.Inputs;

namespace EventReview.Web.Api;

/// <summary>Turns failures into JSON problems that name what was wrong; a failed request has changed nothing.</summary>
public static class ApiResults
{
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        AllowTrailingCommas = false,

        // The web defaults read numbers from strings; a GPS time sent as "123.4" is malformed and must be named.
        NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.Strict,
        UnmappedMemberHandling = System.Text.Json.Serialization.JsonUnmappedMemberHandling.Skip,
    };

    /// <summary>Largest JSON request body read, bytes (1 MiB: a case or a note is far smaller; files go as multipart uploads).</summary>
    public const long MaxJsonBytes = 1024 * 1024;

    /// <summary>Runs an endpoint body, mapping known exceptions to problems.</summary>
    public static async Task<IResult> Guard(Func<Task<IResult>> body)
    {
        try
        {
            return await body();
        }
        catch (KeyNotFoundException ex)
        {
            return Problem(StatusCodes.Status404NotFound, "Not found", ex.Message);
        }
        catch (DomainRuleException ex)
        {
            return Problem(StatusCodes.Status409Conflict, "Refused by a review rule", ex.Message, ex.Rule);
        }
        catch (ConflictException ex)
        {
            return Problem(StatusCodes.Status409Conflict, "Conflicting change", ex.Message, "concurrent-change");
        }
        catch (UnauthorizedAccessException ex)
        {
            return Problem(StatusCodes.Status403Forbidden, "Not allowed", ex.Message);
        }
        catch (AttachmentTooLargeException ex)
        {
            return Problem(StatusCodes.Status413PayloadTooLarge, "File too large", ex.Message);
        }
        catch (BadHttpRequestException ex) when (ex.StatusCode == StatusCodes.Status413PayloadTooLarge)
        {
            return Problem(StatusCodes.Status413PayloadTooLarge, "File too large", "The request body is larger than the upload limit.");
        }
        catch (MalformedRequestException ex)
        {
            return Problem(StatusCodes.Status400BadRequest, "Malformed request", ex.Message, field: ex.Field);
        }
        catch (ArgumentException ex)
        {
            return Problem(StatusCodes.Status422UnprocessableEntity, "Invalid value", UserMessage.From(ex), field: ex.ParamName);
        }
    }

    /// <summary>Reads a JSON body; a malformed body gives a 400 naming the field and what was expected.</summary>
    public static async Task<(T? Value, IResult? Error)> ReadJson<T>(HttpRequest request)
        where T : class
    {
        if (!IsJson(request.ContentType))
        {
            return (null, Problem(StatusCodes.Status415UnsupportedMediaType, "JSON expected",
                $"Send the body as application/json (got {(string.IsNullOrEmpty(request.ContentType) ? "no content type" : $"'{request.ContentType}'")}); nothing was stored."));
        }

        if (request.ContentLength > MaxJsonBytes)
        {
            return (null, TooLarge());
        }

        // Read at most the limit (a body without a length is counted as it arrives), then parse from memory.
        using var body = new MemoryStream();
        var buffer = new byte[16 * 1024];
        int read;
        while ((read = await request.Body.ReadAsync(buffer, request.HttpContext.RequestAborted)) > 0)
        {
            if (body.Length + read > MaxJsonBytes)
            {
                return (null, TooLarge());
            }

            body.Write(buffer, 0, read);
        }

        // JSON is UTF-8 (RFC 8259 §8.1); the serializer would not look inside members it skips, so check the whole body.
        if (!System.Text.Unicode.Utf8.IsValid(body.GetBuffer().AsSpan(0, (int)body.Length)))
        {
            return (null, Problem(StatusCodes.Status400BadRequest, "Malformed JSON", "Malformed JSON at '(body)': the text is not valid UTF-8 (send JSON encoded as UTF-8).", field: "(body)"));
        }

        body.Position = 0;
        try
        {
            var value = await JsonSerializer.DeserializeAsync<T>(body, Json);
            return value is null ? (null, Problem(StatusCodes.Status400BadRequest, "Malformed JSON", "The body is empty or null.")) : (value, null);
        }
        catch (JsonException ex)
        {
            var field = string.IsNullOrEmpty(ex.Path) || ex.Path == "$" ? "(body)" : ex.Path.TrimStart('$', '.');
            if (JsonNumbers.OutOfRange(body.ToArray(), ex.Path, typeof(T)) is { } number)
            {
                // Well-formed JSON holding a number no field can hold (1e400, a GPS time of 30 digits): a value out of range.
                return (null, Problem(StatusCodes.Status422UnprocessableEntity, "Invalid value",
                    $"{field}: the number {number} is out of range (it is not a finite number this field can hold); nothing was stored.", field: field));
            }

            return (null, Problem(StatusCodes.Status400BadRequest, "Malformed JSON",
                $"Malformed JSON at '{field}' (line {ex.LineNumber + 1}): {Explain(ex)}", field: field));
        }
    }

    /// <summary>A 400 naming the first null member of a JSON array (<c>"arrivals": [null]</c>), or null when there is none.</summary>
    public static IResult? NullMember<TItem>(IReadOnlyList<TItem?>? list, string field)
        where TItem : class
    {
        for (var i = 0; i < (list?.Count ?? 0); i++)
        {
            if (list![i] is null)
            {
                return Problem(StatusCodes.Status400BadRequest, "Malformed JSON", $"Malformed JSON at '{field}[{i}]': expected an object, got null.", field: $"{field}[{i}]");
            }
        }

        return null;
    }

    /// <summary>True for application/json and application/*+json (with any parameters, e.g. charset).</summary>
    public static bool IsJson(string? contentType) =>
        Microsoft.Net.Http.Headers.MediaTypeHeaderValue.TryParse(contentType, out var media) && media.MediaType.HasValue &&
        (media.MediaType.Equals("application/json", StringComparison.OrdinalIgnoreCase) ||
         (media.Type.Equals("application", StringComparison.OrdinalIgnoreCase) && media.SubType.EndsWith("+json", StringComparison.OrdinalIgnoreCase)));

    private static IResult TooLarge() => Problem(StatusCodes.Status413PayloadTooLarge, "JSON body too large",
        $"The JSON body is larger than {MaxJsonBytes / 1024} KiB; nothing was stored.");

    public static IResult Problem(int status, string title, string detail, string? rule = null, string? field = null)
    {
        var extensions = new Dictionary<string, object?>();
        if (rule is not null)
        {
            extensions["rule"] = rule;
        }

        if (field is not null)
        {
            extensions["field"] = field;
        }

        return Results.Problem(detail: detail, statusCode: status, title: title, extensions: extensions);
    }

    private static string Explain(JsonException ex)
    {
        for (Exception? inner = ex.InnerException; inner is not null; inner = inner.InnerException)
        {
            if (inner is System.Text.DecoderFallbackException || inner.Message.Contains("UTF-8", StringComparison.OrdinalIgnoreCase))
            {
                return "the text is not valid UTF-8 (send JSON encoded as UTF-8).";
            }
        }

        var m = ex.Message;
        if (m.Contains("could not be converted to System.Nullable`1[System.Decimal]", StringComparison.Ordinal) ||
            m.Contains("could not be converted to System.Nullable`1[System.Double]", StringComparison.Ordinal))
        {
            return "expected a number.";
        }

        if (m.Contains("could not be converted to System.String", StringComparison.Ordinal))
        {
            return "expected a string.";
        }

        var cut = m.IndexOf(" Path:", StringComparison.Ordinal);
        return cut > 0 ? m[..cut] : m;
    }
}
