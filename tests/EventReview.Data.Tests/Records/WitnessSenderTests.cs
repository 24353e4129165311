using System.Net;
using System.Net.Sockets;
using EventReview.Data.Records;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Records;

public sealed class WitnessSenderTests : IDisposable
{
    private readonly TempFolder _folder = new("er-witness-http");

    public void Dispose() => _folder.Dispose();

    private static int FreePort()
    {
        using var l = new TcpListener(IPAddress.Loopback, 0);
        l.Start();
        return ((IPEndPoint)l.LocalEndpoint).Port;
    }

    [Fact]
    public async Task Witness_lines_are_also_posted_to_the_configured_endpoint_as_ndjson()
    {
        var url = $"http://127.0.0.1:{FreePort()}/witness/";
        using var listener = new HttpListener();
        listener.Prefixes.Add(url);
        listener.Start();
        var settings = RecordSettings.ForDataDirectory(_folder.Path) with { WitnessUrl = url };
        using var keys = FileRecordKeyRing.Open(settings.KeyDirectory);
        keys.EnsureSigningKey(DateTimeOffset.UtcNow, false);
        using var witness = new HeadWitness(settings, keys);

        var receive = listener.GetContextAsync();
        witness.Append([new WitnessedHead("case:A", 7, "a7")]);
        var finished = await Task.WhenAny(receive, Task.Delay(TimeSpan.FromSeconds(20)));

        Assert.Same(receive, finished);
        var ctx = await receive;
        using var reader = new StreamReader(ctx.Request.InputStream);
        var body = await reader.ReadToEndAsync();
        ctx.Response.StatusCode = 204;
        ctx.Response.Close();
        Assert.Equal("POST", ctx.Request.HttpMethod);
        Assert.Equal("application/x-ndjson", ctx.Request.ContentType?.Split(';')[0]);
        var line = WitnessLine.Parse(body.Trim());
        Assert.NotNull(line);
        Assert.True(line!.SignatureValid(keys));
        Assert.Equal(7, line.Heads.Single().Sequence);
        Assert.Equal(File.ReadAllText(witness.FilePath).Trim(), body.Trim());
    }

    [Fact]
    public async Task An_endpoint_that_does_not_answer_is_reported_and_never_holds_up_the_file()
    {
        var settings = RecordSettings.ForDataDirectory(_folder.Path) with { WitnessUrl = $"http://127.0.0.1:{FreePort()}/nobody/" };
        using var keys = FileRecordKeyRing.Open(settings.KeyDirectory);
        keys.EnsureSigningKey(DateTimeOffset.UtcNow, false);
        using var witness = new HeadWitness(settings, keys);

        witness.Append([new WitnessedHead("case:A", 1, "a1")]);
        Assert.True(witness.Flush());
        Assert.Equal(1, witness.Read().Lines);
        for (var i = 0; i < 100 && witness.Sender!.LastError is null; i++)
        {
            await Task.Delay(100);
        }

        Assert.NotNull(witness.Sender!.LastError);
    }
}
