using System.Text;
using EventReview.Core.Evidence.Roles;

namespace EventReview.Core.Tests.Evidence.Roles;

public class FileRoleGuesserTests
{
    private static readonly string[] Sites = ["KP", "AB", "SM"];

    private static FileRoleGuess Guess(string name, string text) => FileRoleGuesser.Guess(name, Encoding.UTF8.GetBytes(text), Sites);

    [Theory]
    [InlineData("site,flag,start_gps,end_gps,comment\nKP,gusty-wind,1,2,x\n", FileRoleKind.DataQualitySegments)]
    [InlineData("site,channel,gps_time,snr,frequency_hz,duration_s\nAB,AB:MAG,1.5,7,60,0.1\n", FileRoleKind.AuxiliaryTriggers)]
    [InlineData("site,channel,kind,location,coupling_file,data_file\nAB,AB:MAG,magnetic,vault,,\n", FileRoleKind.SensorInventory)]
    [InlineData("site,start_gps,end_gps,kind,waveform_ref,status\nKP,1,9,cbc,hw-01,performed\n", FileRoleKind.InjectionLog)]
    [InlineData("frequency_hz,coupling\n10,3e-12\n", FileRoleKind.CouplingFunction)]
    [InlineData("{\"stages\": [{\"zerosHz\": [], \"polesHz\": []}]}", FileRoleKind.StageModel)]
    [InlineData("{\"daq\": {\"firmware\": \"4.2\"}}", FileRoleKind.Configuration)]
    [InlineData("# snapshot\nfilter.file = abc123\ncalibration = v7\n", FileRoleKind.Configuration)]
    [InlineData("Meeting notes: nothing to see\nMore words here\n", FileRoleKind.Other)]
    public void A_csv_header_json_or_key_value_layout_gives_the_role(string text, FileRoleKind kind)
    {
        Assert.Equal(kind, Guess("anything.csv", text).Role.Kind);
    }

    [Fact]
    public void Search_triggers_and_analysed_time_take_the_site_from_the_file_name()
    {
        var triggers = Guess("AB-triggers.csv", "# demo\ngps_time,snr,chirp_mass\n1.5,6.1,12\n");
        var segments = Guess("sm_segments.csv", "start_gps,end_gps\n1,100\n");

        Assert.Equal(new FileRole(FileRoleKind.SearchTriggers, "AB"), triggers.Role);
        Assert.Equal(new FileRole(FileRoleKind.AnalysedTime, "SM"), segments.Role);
        Assert.Contains("site SM from the name", segments.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void A_strain_sized_series_is_strain_of_the_site_in_its_name_and_a_larger_one_is_a_sensor_series()
    {
        var strain = Guess("KP-strain.txt", "# simulated\n1000.0 1.2e-21\n1000.00025 -3.4e-21\n1000.0005 2.2e-22\n");
        var sensor = Guess("data-AB-magnetometer-vault-x.txt", "1000.0 1.2e-11\n1000.002 -3.4e-11\n1000.004 8e-12\n");

        Assert.Equal(new FileRole(FileRoleKind.Strain, "KP"), strain.Role);
        Assert.Equal(FileRoleKind.SensorSeries, sensor.Role.Kind);
    }

    [Fact]
    public void Content_beats_a_misleading_name()
    {
        // Adversarial: a file named like strain that holds a magnetometer's series in tesla, and a "triggers" file that is an injection log.
        var sensorNamedStrain = Guess("KP-strain.txt", "1000.0 2.0e-11\n1000.002 -1.0e-11\n1000.004 3e-11\n");
        var logNamedTriggers = Guess("KP-triggers.csv", "site,start_gps,end_gps,kind,waveform_ref,status\nKP,1,9,cbc,hw-01,performed\n");

        Assert.Equal(FileRoleKind.SensorSeries, sensorNamedStrain.Role.Kind);
        Assert.Equal(FileRoleKind.InjectionLog, logNamedTriggers.Role.Kind);
    }

    [Fact]
    public void The_name_separates_what_the_content_cannot()
    {
        Assert.Equal(FileRoleKind.StageInput, Guess("chain-stage1-input.txt", "1 0.5\n2 -0.25\n").Role.Kind);
        Assert.Equal(FileRoleKind.StageOutput, Guess("chain-stage1-output.txt", "1 0.5\n2 -0.25\n").Role.Kind);
        Assert.Equal(FileRoleKind.BlindInjectionRecord, Guess("blind-record-2.csv", "site,start_gps,end_gps,kind,waveform_ref,status\n").Role.Kind);
    }

    [Fact]
    public void An_hdf5_file_is_strain_and_a_site_in_a_comment_is_used_when_the_name_has_none()
    {
        byte[] hdf5 = [0x89, (byte)'H', (byte)'D', (byte)'F', 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0];

        Assert.Equal(new FileRole(FileRoleKind.Strain, "SM"), FileRoleGuesser.Guess("SM-strain.h5", hdf5, Sites).Role);
        Assert.Equal(new FileRole(FileRoleKind.Strain, "AB"), Guess("series.txt", "# simulated strain of demo site AB\n1 1e-21\n2 2e-21\n").Role);
        Assert.Null(Guess("series.txt", "1 1e-21\n2 2e-21\n").Role.Site);
    }

    [Fact]
    public void An_empty_file_is_other()
    {
        Assert.Equal(FileRoleKind.Other, FileRoleGuesser.Guess("empty.txt", [], Sites).Role.Kind);
    }
}
