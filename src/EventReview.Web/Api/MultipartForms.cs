namespace EventReview.Web.Api;

/// <summary>Reads a multipart upload, turning a body that cannot be read into a 400 that says why.</summary>
public static class MultipartForms
{
    /// <summary>True for multipart/form-data (a boundary is checked when the form is read).</summary>
    public static bool IsMultipart(string? contentType) =>
        Microsoft.Net.Http.Headers.MediaTypeHeaderValue.TryParse(contentType, out var media) &&
        media.MediaType.Equals("multipart/form-data", StringComparison.OrdinalIgnoreCase);

    /// <summary>
    /// The whole form. A form without a boundary, with too many fields or parts, with over-long headers or a truncated
    /// body is a <see cref="MalformedRequestException"/>; a body over the server's limit stays a 413.
    /// </summary>
    public static async Task<IFormCollection> ReadAsync(HttpRequest request)
    {
        try
        {
            return await request.ReadFormAsync(request.HttpContext.RequestAborted);
        }
        catch (BadHttpRequestException)
        {
            throw;
        }
        catch (InvalidDataException ex)
        {
            throw new MalformedRequestException("(body)", $"The multipart form could not be read: {ex.Message} Nothing was stored.", ex);
        }
        catch (InvalidOperationException ex)
        {
            throw new MalformedRequestException("Content-Type", $"The multipart form could not be read: {ex.Message} Nothing was stored.", ex);
        }
        catch (IOException ex)
        {
            throw new MalformedRequestException("(body)", "The multipart body ended before its closing boundary (truncated upload); nothing was stored.", ex);
        }
    }
}
