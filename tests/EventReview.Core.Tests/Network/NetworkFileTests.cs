using EventReview.Core.Network;

namespace EventReview.Core.Tests.Network;

public class NetworkFileTests
{
    private const string Json = """
        {"name": "Invented test network", "sites": [
          {"code": "KX", "name": "Site KX", "latitudeDegrees": 44, "longitudeDegrees": -101, "heightMeters": 100,
           "xArmAzimuthDegrees": 62, "yArmAzimuthDegrees": 152, "timingUncertaintySeconds": 0.0001},
          {"code": "MV", "name": "Site MV", "latitudeDegrees": 19, "longitudeDegrees": -71, "heightMeters": 0,
           "xArmAzimuthDegrees": 117, "yArmAzimuthDegrees": 207, "timingUncertaintySeconds": 0.0001}]}
        """;

    [Fact]
    public void A_network_file_reads_and_writes_back_the_same_sites()
    {
        var network = NetworkFile.Parse(Json);
        var again = NetworkFile.Parse(NetworkFile.Write(network));

        Assert.Equal("Invented test network", again.Name);
        Assert.Equal(["KX", "MV"], again.Sites.Select(s => s.Code));
        Assert.Equal(117, again.Sites[1].XArmAzimuthDegrees);
        Assert.Contains("\"timingUncertaintySeconds\"", NetworkFile.Write(network));
    }

    [Fact]
    public void An_invalid_latitude_is_reported_with_the_site_index_and_field()
    {
        var ex = Assert.Throws<FormatException>(() => NetworkFile.Parse(Json.Replace("\"latitudeDegrees\": 19", "\"latitudeDegrees\": 95")));
        Assert.StartsWith("sites[1].latitudeDegrees:", ex.Message);
    }

    [Fact]
    public void A_missing_field_and_a_repeated_code_are_named()
    {
        var missing = Assert.Throws<FormatException>(() => NetworkFile.Parse(Json.Replace("\"heightMeters\": 100,", string.Empty)));
        Assert.Equal("sites[0].heightMeters: missing.", missing.Message);
        var repeated = Assert.Throws<FormatException>(() => NetworkFile.Parse(Json.Replace("\"MV\"", "\"KX\"")));
        Assert.StartsWith("sites[1].code:", repeated.Message);
    }

    [Fact]
    public void Malformed_json_is_a_format_error()
    {
        Assert.Throws<FormatException>(() => NetworkFile.Parse("{\"name\": \"x\", \"sites\": [}"));
    }
}
